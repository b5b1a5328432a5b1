import type { ReactNode } from 'react';
import { SearchX } from 'lucide-react';
import type { Site } from '@shared/schemas/sites';
import { DeadEnd } from '@/components/ui/dead-end';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useSite } from '../api/get-site';

export interface SiteGateProps {
  clubId: number;
  /** From the URL; NaN when the URL holds no number. */
  siteId: number;
  children: (site: Site) => ReactNode;
}

function SiteNotFound({ clubId }: { clubId: number }) {
  return (
    <DeadEnd clubId={clubId} icon={SearchX} title="We can't find that site">
      <p>It may have been removed, or the link belongs to another club.</p>
    </DeadEnd>
  );
}

/** Loads one of the club's sites and renders its page, with the loading, missing and failed states. */
export function SiteGate({ clubId, siteId, children }: SiteGateProps) {
  const valid = Number.isInteger(siteId) && siteId > 0;
  const site = useSite(siteId, { enabled: valid });
  if (!valid || isApiError(site.error, 404)) return <SiteNotFound clubId={clubId} />;
  if (site.isPending) return <LoadingState label="Loading the site…" />;
  if (site.isError) {
    return (
      <ErrorState
        message={site.error.message}
        requestId={isApiError(site.error) ? site.error.requestId : undefined}
        onRetry={() => void site.refetch()}
        retrying={site.isFetching}
      />
    );
  }
  // A site of another club answers 404 from the API; this catches a URL that mixes two of the person's clubs.
  if (site.data.clubId !== clubId) return <SiteNotFound clubId={clubId} />;
  return <>{children(site.data)}</>;
}
