import { Map as MapIcon, Printer } from 'lucide-react';
import { Link, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { useNeighbourCheckOverlay } from '@/features/findings/components/neighbour-check-overlay';
import { MapEditor } from '@/features/plots/components/map/map-editor';
import { useSites } from '@/features/sites/api/get-sites';
import { usePlotStates } from '@/features/spring-round/api/get-plot-states';
import { useSeasons } from '@/features/spring-round/api/get-seasons';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/map?site=ID`: one site's map; coordinators edit it, everyone else looks. */
export function MapRoute() {
  const { club } = useClubContext();
  const sites = useSites(club.clubId);
  const [params, setParams] = useSearchParams();
  const canEdit = club.roles.includes('coordinator');
  const seasons = useSeasons(club.clubId);
  const newest = seasons.data?.items[0] ?? null;
  const wantedSite = Number(params.get('site'));
  const shownSiteId = sites.data ? (sites.data.items.find((s) => s.id === wantedSite) ?? sites.data.items[0])?.id ?? 0 : 0;
  const states = usePlotStates(newest?.id ?? null, shownSiteId);
  // Coordinators may lay the season's neighbour check over the map; nobody else asks for it.
  const check = useNeighbourCheckOverlay({
    siteId: shownSiteId,
    seasonId: seasons.isPending ? undefined : (newest?.id ?? null),
    seasonYear: newest?.year,
    plotBookHref: (plotId) => paths.plotBook(club.clubId, plotId, newest?.year),
  });

  if (sites.isPending) return <LoadingState label="Loading the sites…" />;
  if (sites.isError) return <ErrorState headingLevel="h1" title="The sites could not be loaded" message={sites.error.message} onRetry={() => void sites.refetch()} />;
  const items = sites.data.items;
  if (items.length === 0) {
    return (
      <EmptyState
        icon={MapIcon}
        title="No sites yet"
        action={canEdit ? <Link to={paths.sites(club.clubId)}>Add the club's first site</Link> : undefined}
      >
        {canEdit ? 'Add a site, then draw its plots here.' : 'The coordinator has not drawn a site yet.'}
      </EmptyState>
    );
  }
  const wanted = Number(params.get('site'));
  const site = items.find((s) => s.id === wanted) ?? items[0];

  return (
    <div>
      <PageHeader
        eyebrow={club.clubName}
        title={`Map of ${site.name}`}
        description={`${site.plotCount} plots on ${site.units === 'us' ? 'a site measured in feet' : 'a site measured in metres'}.`}
        actions={
          <div className="flex flex-wrap gap-3">
            <Link to={paths.weather(club.clubId, site.id)} className="inline-flex min-h-11 items-center font-medium">
              Weather log
            </Link>
            <Link to={paths.siteWater(club.clubId, site.id)} className="inline-flex min-h-11 items-center font-medium">
              Water
            </Link>
            <Link to={paths.sitePrint(club.clubId, site.id)} className="inline-flex min-h-11 items-center gap-1.5 font-medium">
              <Printer className="size-5" aria-hidden="true" />
              Print map
            </Link>
            {canEdit && (
              <>
                <Link to={paths.siteTasks(club.clubId, site.id)} className="inline-flex min-h-11 items-center font-medium">
                  Tasks
                </Link>
                <Link to={paths.sitePlots(club.clubId, site.id)} className="inline-flex min-h-11 items-center font-medium">
                  Plots table and CSV
                </Link>
                <Link to={paths.siteEdit(club.clubId, site.id)} className="inline-flex min-h-11 items-center font-medium">
                  Site settings
                </Link>
              </>
            )}
          </div>
        }
      />
      {items.length > 1 && (
        <nav aria-label="Sites" className="mb-4 flex flex-wrap gap-2">
          {items.map((s) => (
            <button
              key={s.id}
              type="button"
              aria-current={s.id === site.id ? 'page' : undefined}
              onClick={() => setParams({ site: String(s.id) })}
              className={`min-h-11 rounded-full border px-4 font-medium ${
                s.id === site.id ? 'border-leaf bg-leaf text-white' : 'border-paper-300 bg-white text-soil hover:bg-paper-100'
              }`}
            >
              {s.name}
            </button>
          ))}
        </nav>
      )}
      <MapEditor
        key={site.id}
        site={site}
        canEdit={canEdit}
        initialPlotId={Number(params.get('plot')) || null}
        seasonStates={states.data?.items}
        seasonYear={newest?.year}
        overlay={canEdit ? check.overlay : undefined}
        plotHref={(plotId) => paths.plot(club.clubId, plotId)}
      />
    </div>
  );
}
