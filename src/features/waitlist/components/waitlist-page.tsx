import { useCallback, useState } from 'react';
import { Download, Upload } from 'lucide-react';
import type { WaitlistEntry } from '@shared/schemas/applications';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useWaitlist } from '../api/get-waitlist';
import type { WaitlistFilters } from '../api/keys';
import { waitlistCsvUrl } from '../api/waitlist-files';
import { CoordinatorsOnly } from '@/components/coordinators-only';
import { HistoryDialog } from './history-dialog';
import { MoveDialog } from './move-dialog';
import { RemoveDialog } from './remove-dialog';
import { ShareFormLink } from './share-form-link';
import { WaitlistImport } from './waitlist-import';
import { WaitlistTable, type WaitlistAction } from './waitlist-table';

type Status = NonNullable<WaitlistFilters['status']>;
type Needs = NonNullable<WaitlistFilters['needs']> | '';

export interface WaitlistPageProps {
  clubId: number;
  clubName: string;
  /** The full address of the club's public application form. */
  applyUrl: string;
  sites: Array<{ id: number; name: string }>;
}

/** The coordinator's waiting list: the queue with filters, moves and removals with reasons, import and export. */
export function WaitlistPage({ clubId, clubName, applyUrl, sites }: WaitlistPageProps) {
  const [status, setStatus] = useState<Status>('waiting');
  const [needs, setNeeds] = useState<Needs>('');
  const [siteId, setSiteId] = useState<number | undefined>(undefined);
  const [open, setOpen] = useState<{ action: WaitlistAction; entry: WaitlistEntry } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const filters: WaitlistFilters = { status, needs: needs || undefined, siteId };
  const list = useWaitlist(clubId, filters);
  // Positions count everyone waiting, whatever the filter shows; the unfiltered count bounds a move.
  const everyone = useWaitlist(clubId, { status: 'waiting' });

  const onAction = useCallback((action: WaitlistAction, entry: WaitlistEntry) => {
    setNotice(null);
    setOpen({ action, entry });
  }, []);
  const close = () => setOpen(null);
  const done = (message: string) => {
    setOpen(null);
    setNotice(message);
  };

  if (isApiError(list.error, 403)) {
    return (
      <>
        <title>{`Not allowed · ${clubName} · Tillwell`}</title>
        <CoordinatorsOnly clubId={clubId} page="people" />
      </>
    );
  }

  const waiting = everyone.data?.total ?? 0;

  return (
    <>
      <title>{`Waiting list · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Waiting list"
        description="People waiting for a plot, in the order offers go out. Every move and removal keeps its reason."
        actions={
          <>
            <a href={waitlistCsvUrl(clubId)} download className={buttonClasses('secondary')}>
              <Download className="size-5" aria-hidden="true" />
              Download CSV
            </a>
            <a href="#import-waitlist" className={buttonClasses('secondary')}>
              <Upload className="size-5" aria-hidden="true" />
              Import
            </a>
          </>
        }
      />
      <div className="flex flex-col gap-10">
        <Card>
          <ShareFormLink url={applyUrl} />
        </Card>

        <PageSection id="the-queue" title={everyone.data ? `The queue (${waiting} waiting)` : 'The queue'}>
          <div className="mb-4 grid gap-4 sm:grid-cols-3">
            <Select label="Show" value={status} onChange={(e) => setStatus(e.target.value as Status)}>
              <option value="waiting">Waiting</option>
              <option value="offered">Offered a plot</option>
              <option value="all">Everyone, past and present</option>
            </Select>
            <Select label="Needs" value={needs} onChange={(e) => setNeeds(e.target.value as Needs)}>
              <option value="">Any</option>
              <option value="accessible">Wheelchair-accessible bed</option>
              <option value="raised">Raised bed</option>
            </Select>
            <Select
              label="Preferred site"
              value={siteId ?? ''}
              onChange={(e) => setSiteId(e.target.value ? Number(e.target.value) : undefined)}
            >
              <option value="">Any site</option>
              {sites.map((site) => (
                <option key={site.id} value={site.id}>
                  {site.name}
                </option>
              ))}
            </Select>
          </div>
          {notice && (
            <Alert tone="success" className="mb-4">
              {notice}
            </Alert>
          )}
          {list.isPending ? (
            <LoadingState label="Loading the waitlist…" />
          ) : list.isError ? (
            <ErrorState
              message={list.error.message}
              requestId={isApiError(list.error) ? list.error.requestId : undefined}
              onRetry={() => void list.refetch()}
              retrying={list.isFetching}
            />
          ) : (
            <WaitlistTable entries={list.data.items} onAction={onAction} />
          )}
        </PageSection>

        <PageSection id="import-waitlist" title="Import a waiting list">
          <Card>
            <p className="mb-5 text-stone">
              Moving from a spreadsheet? Bring your list in once, with the date each person applied, and the queue keeps
              their places.
            </p>
            <WaitlistImport clubId={clubId} />
          </Card>
        </PageSection>
      </div>

      <MoveDialog entry={open?.action === 'move' ? open.entry : null} waiting={waiting} onClose={close} onDone={done} />
      <RemoveDialog entry={open?.action === 'remove' ? open.entry : null} onClose={close} onDone={done} />
      <HistoryDialog entry={open?.action === 'history' ? open.entry : null} onClose={close} />
    </>
  );
}
