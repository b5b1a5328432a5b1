import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowLeft, Map as MapIcon, Table2 } from 'lucide-react';
import type { Site } from '@shared/schemas/sites';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/lib/paths';
import { SiteBackgroundForm } from './site-background-form';
import { SiteForm } from './site-form';
import { SiteRemove } from './site-remove';

function Section({ id, title, description, children }: { id: string; title: string; description?: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="min-w-0">
      <h2 id={id} className="text-xl font-semibold">
        {title}
      </h2>
      {description && <p className="mt-1 text-stone">{description}</p>}
      <Card className="mt-4">{children}</Card>
    </section>
  );
}

/** A site's settings: its details form and its map background. */
export function SiteEditPage({ clubId, clubName, site }: { clubId: number; clubName: string; site: Site }) {
  return (
    <>
      <title>{`Edit ${site.name} · ${clubName} · Tillwell`}</title>
      <Link to={paths.sites(clubId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
        <ArrowLeft className="size-5" aria-hidden="true" />
        All sites
      </Link>
      <PageHeader
        eyebrow={clubName}
        title={site.name}
        description="Change where the site is, how big it is, and the units its map and tables use."
        actions={
          <>
            <Link to={paths.sitePlots(clubId, site.id)} className={buttonClasses('secondary')}>
              <Table2 className="size-5" aria-hidden="true" />
              Plots
            </Link>
            <Link to={`${paths.map(clubId)}?site=${site.id}`} className={buttonClasses('secondary')}>
              <MapIcon className="size-5" aria-hidden="true" />
              Map
            </Link>
          </>
        }
      />
      <div className="grid gap-10 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Section id="site-details" title="Details">
          <SiteForm clubId={clubId} site={site} />
        </Section>
        <Section
          id="site-background"
          title="Map background"
          description="A picture under the plots on the map, scaled to the site."
        >
          <SiteBackgroundForm site={site} />
        </Section>
        <Section id="site-remove" title="Archive or delete">
          <SiteRemove clubId={clubId} site={site} />
        </Section>
      </div>
    </>
  );
}
