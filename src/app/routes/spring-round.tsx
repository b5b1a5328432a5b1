import { CalendarRange } from 'lucide-react';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { useNeighbourCheckOverlay } from '@/features/findings/components/neighbour-check-overlay';
import { AllocationMap, type AllocationPerson } from '@/features/plots/components/map/allocation-map';
import { useClubSettings } from '@/features/club-settings/api/get-club-settings';
import { useSites } from '@/features/sites/api/get-sites';
import { useCreateOffer } from '@/features/spring-round/api/create-offer';
import { getOfferQuote } from '@/features/spring-round/api/get-offer-quote';
import { usePlotStates } from '@/features/spring-round/api/get-plot-states';
import { useSeasons } from '@/features/spring-round/api/get-seasons';
import { useWaitingPeople } from '@/features/spring-round/api/get-waiting-people';
import { useWithdrawOffer } from '@/features/spring-round/api/withdraw-offer';
import { OpenSeasonForm } from '@/features/spring-round/components/open-season-form';
import { LeftOutList } from '@/features/spring-round/components/left-out-list';
import { SeasonSummary } from '@/features/spring-round/components/season-summary';
import { paths } from '@/lib/paths';
import { LocalDate, useTimeZone } from '@/lib/time-zone';
import { localToday } from '@shared/dates';
import type { Season } from '@shared/schemas/seasons';
import type { Site } from '@shared/schemas/sites';
import { useClubContext } from '../app-context';

const sizeWords = { small: 'small plot', medium: 'medium plot', large: 'large plot', any: 'any size' } as const;

function SeasonMap({ clubId, season, site }: { clubId: number; season: Season; site: Site }) {
  const states = usePlotStates(season.id, site.id);
  const waiting = useWaitingPeople(clubId);
  const offer = useCreateOffer(season.id, () => waiting.refetch());
  const withdraw = useWithdrawOffer(() => waiting.refetch());
  const check = useNeighbourCheckOverlay({
    siteId: site.id,
    seasonId: season.id,
    seasonYear: season.year,
    plotBookHref: (plotId) => paths.plotBook(clubId, plotId, season.year),
  });
  if (states.isPending || waiting.isPending) return <LoadingState label="Loading the season…" />;
  if (states.isError) return <ErrorState title="The season could not be loaded" message={states.error.message} onRetry={() => void states.refetch()} />;
  if (waiting.isError) return <ErrorState title="The waiting list could not be loaded" message={waiting.error.message} onRetry={() => void waiting.refetch()} />;
  const people: AllocationPerson[] = waiting.data.items.map((w) => ({
    id: w.id,
    name: w.name,
    position: w.position,
    detail: [
      `waited ${w.waitedDays} days`,
      sizeWords[w.preferredSize],
      w.needsRaised ? 'raised bed' : null,
      w.preferredSiteName ? `prefers ${w.preferredSiteName}` : null,
    ]
      .filter(Boolean)
      .join(' · '),
    preferredSize: w.preferredSize,
    needsAccessible: w.needsAccessible,
    needsRaised: w.needsRaised,
    preferredSiteId: w.preferredSiteId,
  }));
  return (
    <AllocationMap
      site={site}
      states={states.data.items}
      people={people}
      plotHref={(plotId) => paths.plot(clubId, plotId)}
      onQuote={(plotId, applicationId) => getOfferQuote(season.id, plotId, applicationId)}
      onOffer={(plotId, applicationId) => offer.mutateAsync({ plotId, applicationId })}
      onWithdraw={(offerId) => withdraw.mutateAsync(offerId)}
      overlay={check.overlay}
    />
  );
}

/** `/clubs/:clubId/spring-round`: open the season, watch renewals, and offer free plots from the map. */
export function SpringRoundRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) {
    return <CoordinatorsOnly clubId={club.clubId} page="spring-round" />;
  }
  return <SpringRound />;
}

function SpringRound() {
  const { club } = useClubContext();
  const seasons = useSeasons(club.clubId);
  const sites = useSites(club.clubId);
  const settings = useClubSettings(club.clubId);
  const [params, setParams] = useSearchParams();
  const [justOpened, setJustOpened] = useState(false);
  const zone = useTimeZone();

  if (seasons.isPending || sites.isPending) return <LoadingState label="Loading the spring round…" />;
  if (seasons.isError) return <ErrorState title="The seasons could not be loaded" message={seasons.error.message} onRetry={() => void seasons.refetch()} />;
  if (sites.isError) return <ErrorState title="The sites could not be loaded" message={sites.error.message} onRetry={() => void sites.refetch()} />;

  const current = seasons.data.items[0];
  const thisYear = Number(localToday(zone).slice(0, 4));
  const nextYear = current ? current.year + 1 : thisYear + 1;
  // Next year's season is already open: the one after waits until its own year comes round.
  const openedAhead = current !== undefined && current.year > thisYear;
  const site = sites.data.items.find((s) => s.id === Number(params.get('site'))) ?? sites.data.items[0];

  return (
    <div className="space-y-8">
      <PageHeader
        eyebrow={club.clubName}
        title={current ? `Spring round ${current.year}` : 'Spring round'}
        description="Renew last season's plot holders, then offer the free plots to the waiting list in fair order."
      />
      {current ? (
        <>
          <SeasonSummary season={current} justOpened={justOpened} />
          {site ? (
            <section aria-labelledby="season-map" className="space-y-3">
              <h2 id="season-map" className="text-xl font-semibold">
                Plots this season
              </h2>
              {sites.data.items.length > 1 && (
                <nav aria-label="Sites" className="flex flex-wrap gap-2">
                  {sites.data.items.map((s) => (
                    <button
                      key={s.id}
                      type="button"
                      aria-current={s.id === site.id ? 'page' : undefined}
                      onClick={() => setParams({ site: String(s.id) })}
                      className={`min-h-11 rounded-full border px-4 font-medium ${s.id === site.id ? 'border-leaf bg-leaf text-white' : 'border-paper-300 bg-white text-soil hover:bg-paper-100'}`}
                    >
                      {s.name}
                    </button>
                  ))}
                </nav>
              )}
              <SeasonMap key={`${current.id}-${site.id}`} clubId={club.clubId} season={current} site={site} />
            </section>
          ) : (
            <EmptyState icon={CalendarRange} title="No sites yet">
              Draw a site and its plots first; then you can offer them here.
            </EmptyState>
          )}
          {/* Below the map, so its loading never moves the map under a drag. */}
          <LeftOutList season={current} />
        </>
      ) : (
        <EmptyState icon={CalendarRange} title="No season is open yet">
          Open the first season below. Plots on the map then show as free, offered or taken.
        </EmptyState>
      )}
      <section aria-labelledby="open-season" className="space-y-3">
        <h2 id="open-season" className="text-xl font-semibold">
          Open the {nextYear} season
        </h2>
        {openedAhead ? (
          <p className="text-stone">
            The {current.year} season is already open. The {nextYear} season can be opened from{' '}
            <LocalDate value={`${current.year}-01-01T12:00:00Z`} />.
          </p>
        ) : (
          <>
            <p className="text-stone">
              Holders of {current ? current.year : 'last season'} whose fees are paid get an e-mail to keep or give up their plot
              by the deadline; plots not kept by then become free. You see how many e-mails will go before anything is sent.
            </p>
            <OpenSeasonForm
              key={`${settings.data?.renewalDays ?? 'loading'}-${nextYear}`}
              clubId={club.clubId}
              suggestedYear={nextYear}
              renewalDays={settings.data?.renewalDays ?? 14}
              previousDeadline={current?.renewalDeadline ?? null}
              onOpened={() => setJustOpened(true)}
            />
          </>
        )}
      </section>
    </div>
  );
}
