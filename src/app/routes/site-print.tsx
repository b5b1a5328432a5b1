import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ArrowLeft, Printer } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { useSitePlots } from '@/features/plots/api/get-site-plots';
import {
  holderNameLabels,
  holderNameModes,
  PrintMap,
  PrintMapLegend,
  readHolderNameMode,
} from '@/features/plots/components/print/print-map';
import { SiteGate } from '@/features/sites/components/site-gate';
import { usePlotStates } from '@/features/spring-round/api/get-plot-states';
import { useSeasons } from '@/features/spring-round/api/get-seasons';
import { isApiError } from '@/lib/api/client';
import { formatDate } from '@/lib/format';
import { paths } from '@/lib/paths';
import type { Site } from '@shared/schemas/sites';
import { useClubContext } from '../app-context';

function SitePrintSheet({ site }: { site: Site }) {
  const { club } = useClubContext();
  const [params, setParams] = useSearchParams();
  const coordinator = club.roles.includes('coordinator');
  // Holders' names reach coordinators only; everyone else's sheet shows the labels alone.
  const names = coordinator ? readHolderNameMode(params.get('names')) : 'none';
  const plots = useSitePlots(site.id);
  const seasons = useSeasons(club.clubId);
  const newest = seasons.data?.items[0] ?? null;
  const states = usePlotStates(newest?.id ?? null, site.id);

  const waitingForStates = seasons.isPending || (newest !== null && states.isPending);
  if (plots.isPending || waitingForStates) return <LoadingState label="Loading the map…" />;
  const failed = plots.error ?? seasons.error ?? states.error;
  if (failed) {
    return (
      <ErrorState
        title="The map could not be loaded"
        message={failed.message}
        requestId={isApiError(failed) ? failed.requestId : undefined}
        onRetry={() => {
          void plots.refetch();
          void seasons.refetch();
          void states.refetch();
        }}
      />
    );
  }
  const items = plots.data?.items ?? [];
  const printedOn = formatDate(new Date().toISOString(), site.timeZone);

  return (
    <article aria-labelledby="print-title" className="print-sheet flex flex-col gap-3">
      <div className="no-print flex flex-wrap items-end justify-between gap-4">
        <Link to={paths.map(club.clubId, site.id)} className="inline-flex min-h-11 items-center gap-1.5 font-medium">
          <ArrowLeft className="size-5" aria-hidden="true" />
          Back to the map
        </Link>
        <div className="flex flex-wrap items-end gap-3">
          {coordinator && (
            <Select
              label="Holders on the map"
              value={names}
              onChange={(e) => {
                const next = new URLSearchParams(params);
                next.set('names', e.target.value);
                setParams(next, { replace: true });
              }}
            >
              {holderNameModes.map((m) => (
                <option key={m} value={m}>
                  {holderNameLabels[m]}
                </option>
              ))}
            </Select>
          )}
          <Button onClick={() => window.print()}>
            <Printer className="size-5" aria-hidden="true" />
            Print
          </Button>
        </div>
      </div>
      <div className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1 border-b-2 border-soil pb-2">
        <div>
          <p className="text-sm font-semibold tracking-wide text-leaf uppercase">{club.clubName}</p>
          <h1 id="print-title" className="text-2xl font-bold break-words">
            {site.name}: site map
          </h1>
        </div>
        <p className="text-stone">
          {newest ? `Season ${newest.year} · ` : ''}
          {items.length} {items.length === 1 ? 'plot' : 'plots'} · Printed {printedOn}
        </p>
      </div>
      <PrintMap site={site} plots={items} states={states.data?.items ?? []} names={names} />
      <PrintMapLegend names={names} withSeason={newest !== null} seasonYear={newest?.year} />
    </article>
  );
}

/** `/clubs/:clubId/sites/:siteId/print?names=initials|full|none`: the site's map on one landscape page, for the noticeboard. */
export function SitePrintRoute() {
  const { club } = useClubContext();
  const { siteId } = useParams();
  return (
    <SiteGate clubId={club.clubId} siteId={Number(siteId)}>
      {(site) => (
        <>
          <title>{`Print map · ${site.name} · Tillwell`}</title>
          <SitePrintSheet site={site} />
        </>
      )}
    </SiteGate>
  );
}
