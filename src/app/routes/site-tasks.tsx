import { Link, useParams } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import type { Site } from '@shared/schemas/sites';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { useSitePlots } from '@/features/plots/api/get-site-plots';
import { useSites } from '@/features/sites/api/get-sites';
import { SiteGate } from '@/features/sites/components/site-gate';
import { SiteTasksPage } from '@/features/tasks/components/site-tasks-page';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useClubContext } from '../app-context';

/** `/clubs/:clubId/sites/:siteId/tasks?kind=&plotId=&status=&from=&to=`: a site's tasks as a table, for coordinators. */
export function SiteTasksRoute() {
  const { club } = useClubContext();
  const { siteId } = useParams();
  if (!club.roles.includes('coordinator')) return <CoordinatorsOnly clubId={club.clubId} page="tasks" />;
  return <SiteGate clubId={club.clubId} siteId={Number(siteId)}>{(site) => <SiteTasks site={site} />}</SiteGate>;
}

function SiteTasks({ site }: { site: Site }) {
  const { club } = useClubContext();
  const plots = useSitePlots(site.id);
  const sites = useSites(club.clubId);
  const back = (
    <Link to={paths.sites(club.clubId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
      <ArrowLeft className="size-5" aria-hidden="true" />
      All sites
    </Link>
  );
  if (plots.isPending) return <LoadingState label="Loading the site’s plots…" />;
  if (plots.isError) {
    return (
      <ErrorState
        title="The site’s plots didn't load"
        message={plots.error.message}
        requestId={isApiError(plots.error) ? plots.error.requestId : undefined}
        onRetry={() => void plots.refetch()}
        retrying={plots.isFetching}
      />
    );
  }
  return (
    <>
      {back}
      <SiteTasksPage
        clubId={club.clubId}
        site={site}
        plots={plots.data.items.map((p) => ({ id: p.id, label: p.label, kind: p.kind }))}
        sites={(sites.data?.items ?? []).map((s) => ({ id: s.id, name: s.name }))}
      />
    </>
  );
}
