import { Link, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { ArrowLeft, Map as MapIcon, Pencil } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PlotImport } from '@/features/plots/components/plot-import';
import { PlotsTable } from '@/features/plots/components/plots-table';
import { invalidateSite } from '@/features/sites/api/invalidate';
import { SiteGate } from '@/features/sites/components/site-gate';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/sites/:siteId/plots`: the site's plot table for members, and the CSV import for coordinators. */
export function SitePlotsRoute() {
  const { club } = useClubContext();
  const { siteId } = useParams();
  const queryClient = useQueryClient();
  const coordinator = club.roles.includes('coordinator');
  const clubId = club.clubId;

  return (
    <SiteGate clubId={clubId} siteId={Number(siteId)}>
      {(site) => (
        <>
          <title>{`Plots · ${site.name} · Tillwell`}</title>
          {coordinator && (
            <Link to={paths.sites(clubId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
              <ArrowLeft className="size-5" aria-hidden="true" />
              All sites
            </Link>
          )}
          <PageHeader
            eyebrow={site.name}
            title="Plots"
            description={`${site.plotCount} ${site.plotCount === 1 ? 'plot' : 'plots'}, sizes in ${site.units === 'us' ? 'feet' : 'metres'}. Open a plot to see its neighbours and history.`}
            actions={
              coordinator && (
                <>
                  <Link to={`${paths.map(clubId)}?site=${site.id}`} className={buttonClasses('secondary')}>
                    <MapIcon className="size-5" aria-hidden="true" />
                    Map
                  </Link>
                  <Link to={paths.siteEdit(clubId, site.id)} className={buttonClasses('secondary')}>
                    <Pencil className="size-5" aria-hidden="true" />
                    Edit site
                  </Link>
                </>
              )
            }
          />
          <div className="flex flex-col gap-10">
            <PlotsTable clubId={clubId} siteId={site.id} siteName={site.name} units={site.units} canImport={coordinator} />
            {coordinator && (
              <section aria-labelledby="import-plots" className="min-w-0">
                <h2 id="import-plots" className="mb-4 text-xl font-semibold">
                  Import plots from a CSV file
                </h2>
                <Card>
                  <PlotImport
                    siteId={site.id}
                    siteName={site.name}
                    siteUnits={site.units}
                    onImported={() => void invalidateSite(queryClient, site.id)}
                  />
                </Card>
              </section>
            )}
          </div>
        </>
      )}
    </SiteGate>
  );
}
