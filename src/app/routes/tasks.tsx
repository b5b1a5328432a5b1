import { Link, Navigate } from 'react-router-dom';
import { Droplets, LandPlot, ListChecks } from 'lucide-react';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { useSites } from '@/features/sites/api/get-sites';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/tasks`: the coordinators' way in to the tasks: the only site's tasks, or a choice of site. */
export function TasksRoute() {
  const { club } = useClubContext();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="tasks" />;
  return <TaskSites />;
}

function TaskSites() {
  const { club } = useClubContext();
  const sites = useSites(club.clubId);
  if (sites.isPending) return <LoadingState label="Loading the sites…" />;
  if (sites.isError) {
    return (
      <ErrorState
        title="The sites didn't load"
        message={sites.error.message}
        requestId={isApiError(sites.error) ? sites.error.requestId : undefined}
        onRetry={() => void sites.refetch()}
        retrying={sites.isFetching}
      />
    );
  }
  const items = sites.data.items;
  if (items.length === 1) return <Navigate to={paths.siteTasks(club.clubId, items[0].id)} replace />;
  const header = (
    <>
      <title>{`Tasks · ${club.clubName} · Tillwell`}</title>
      <PageHeader eyebrow={club.clubName} title="Tasks" description="The season’s tasks are kept per site. Choose a site to see its tasks and its water." />
    </>
  );
  if (items.length === 0) {
    return (
      <>
        {header}
        <Card>
          <EmptyState
            icon={LandPlot}
            title="No sites yet"
            action={
              <Link to={paths.sites(club.clubId)} className={buttonClasses('primary')}>
                Add a site
              </Link>
            }
          >
            <p>Tasks come from the plantings on a site’s plots. Add the club’s first site and its plots to begin.</p>
          </EmptyState>
        </Card>
      </>
    );
  }
  return (
    <>
      {header}
      <ul className="grid grid-cols-1 gap-4 sm:grid-cols-2" aria-label="Sites">
        {items.map((s) => (
          <li key={s.id}>
            <Card className="flex h-full flex-col gap-3">
              <h2 className="text-xl font-semibold">{s.name}</h2>
              {s.address && <p className="-mt-2 text-sm text-stone">{s.address}</p>}
              <p className="text-stone">
                {s.plotCount} {s.plotCount === 1 ? 'plot' : 'plots'}, in {s.units === 'us' ? 'US units' : 'metric units'}.
              </p>
              <div className="mt-auto flex flex-wrap gap-3">
                <Link to={paths.siteTasks(club.clubId, s.id)} className={buttonClasses('primary')} aria-label={`Tasks at ${s.name}`}>
                  <ListChecks className="size-5" aria-hidden="true" />
                  Tasks
                </Link>
                <Link to={paths.siteWater(club.clubId, s.id)} className={buttonClasses('secondary')} aria-label={`Water at ${s.name}`}>
                  <Droplets className="size-5" aria-hidden="true" />
                  Water
                </Link>
              </div>
            </Card>
          </li>
        ))}
      </ul>
    </>
  );
}
