import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { LandPlot, Plus } from 'lucide-react';
import type { Site } from '@shared/schemas/sites';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useSites } from '../api/get-sites';
import { SiteForm } from './site-form';
import { SitesTable } from './sites-table';

export interface SitesPageProps {
  clubId: number;
  clubName: string;
}

/** Coordinators' list of the club's sites, with a form to add one. */
export function SitesPage({ clubId, clubName }: SitesPageProps) {
  const sites = useSites(clubId);
  const [adding, setAdding] = useState(false);
  const [created, setCreated] = useState<Site | null>(null);
  const formHeading = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    // Opening the form moves focus to it, so keyboard and screen-reader users land where they asked to go.
    if (adding) formHeading.current?.focus();
  }, [adding]);

  const startAdding = () => {
    setCreated(null);
    setAdding(true);
  };

  return (
    <>
      <title>{`Sites · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Sites"
        description="The pieces of ground the club gardens on. Each has its own map, plots and units."
        actions={
          !adding && (
            <Button onClick={startAdding}>
              <Plus className="size-5" aria-hidden="true" />
              New site
            </Button>
          )
        }
      />

      <div className="flex flex-col gap-8">
        {created && (
          <Alert tone="success" title={`${created.name} is added`}>
            <p>
              Next, <Link to={paths.sitePlots(clubId, created.id)}>add its plots from a CSV file</Link> or{' '}
              <Link to={paths.siteEdit(clubId, created.id)}>upload a map background</Link>.
            </p>
          </Alert>
        )}

        {adding && (
          <section aria-labelledby="new-site">
            <Card>
              <h2 id="new-site" ref={formHeading} tabIndex={-1} className="mb-6 text-xl font-semibold focus:outline-none">
                New site
              </h2>
              <SiteForm
                clubId={clubId}
                onSaved={(site) => {
                  setCreated(site);
                  setAdding(false);
                }}
                onCancel={() => setAdding(false)}
              />
            </Card>
          </section>
        )}

        <section aria-labelledby="club-sites" className="min-w-0">
          <h2 id="club-sites" className="sr-only">
            All sites
          </h2>
          {sites.isPending ? (
            <LoadingState label="Loading sites…" />
          ) : sites.isError ? (
            <ErrorState
              message={sites.error.message}
              requestId={isApiError(sites.error) ? sites.error.requestId : undefined}
              onRetry={() => void sites.refetch()}
              retrying={sites.isFetching}
            />
          ) : sites.data.items.length === 0 ? (
            <Card>
              <EmptyState
                icon={LandPlot}
                title="No sites yet"
                action={
                  !adding && (
                    <Button onClick={startAdding}>
                      <Plus className="size-5" aria-hidden="true" />
                      Add the first site
                    </Button>
                  )
                }
              >
                <p>Add the ground the club gardens on: its size, units and frost dates. Plots come next.</p>
              </EmptyState>
            </Card>
          ) : (
            <SitesTable clubId={clubId} sites={sites.data.items} />
          )}
        </section>
      </div>
    </>
  );
}
