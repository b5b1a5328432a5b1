import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ColumnDef } from '@tanstack/react-table';
import {
  mailKindLabels,
  outboxStatuses,
  outboxStatusLabels,
  type OutboxMessage,
  type OutboxQuery,
  type OutboxStatus,
} from '@shared/schemas/outbox';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/lib/paths';
import { useTimeZone } from '@/lib/time-zone';
import { useOutbox } from '../api/get-outbox';
import { useResendMail } from '../api/resend-mail';

const filterLabels: Record<OutboxQuery['status'], string> = {
  all: 'All mail',
  failed: outboxStatusLabels.failed,
  waiting: outboxStatusLabels.waiting,
  sent: outboxStatusLabels.sent,
};

const tones: Record<OutboxStatus, 'neutral' | 'leaf' | 'straw'> = { failed: 'straw', waiting: 'neutral', sent: 'leaf' };

function readStatus(value: string | null): OutboxQuery['status'] {
  return outboxStatuses.find((s) => s === value) ?? 'all';
}

/** When it went, when it is tried next, or that it was given up on, in words. */
function progress(m: OutboxMessage, zone: string): string {
  if (m.status === 'sent') return m.sentAt ? `Sent ${formatDateTime(m.sentAt, zone)}` : 'Sent';
  if (m.status === 'failed') return `Gave up after ${m.attempts} ${m.attempts === 1 ? 'try' : 'tries'}`;
  return m.attempts === 0 ? 'Sending shortly' : `Tried ${m.attempts} ${m.attempts === 1 ? 'time' : 'times'}; next try ${formatDateTime(m.nextAttemptAt, zone)}`;
}

function columns(resend: (m: OutboxMessage) => void, busyId: number | null, zone: string): ColumnDef<OutboxMessage>[] {
  return [
    {
      id: 'status',
      header: 'Status',
      accessorFn: (m) => outboxStatusLabels[m.status],
      cell: ({ row }) => <Badge tone={tones[row.original.status]}>{outboxStatusLabels[row.original.status]}</Badge>,
    },
    {
      id: 'created',
      header: 'Written',
      accessorFn: (m) => m.createdAt,
      enableGlobalFilter: false,
      cell: ({ row }) => <span className="whitespace-nowrap">{formatDateTime(row.original.createdAt, zone)}</span>,
    },
    { id: 'to', header: 'To', accessorFn: (m) => m.to, cell: ({ getValue }) => <span className="break-all">{getValue<string>()}</span> },
    {
      id: 'subject',
      header: 'Subject',
      accessorFn: (m) => `${m.subject} ${mailKindLabels[m.kind]}`,
      cell: ({ row }) => (
        <div className="flex flex-col">
          <span className="font-medium">{row.original.subject}</span>
          <span className="text-sm text-stone">{mailKindLabels[row.original.kind]}</span>
        </div>
      ),
    },
    {
      id: 'progress',
      header: 'What happened',
      accessorFn: (m) => m.lastError ?? '',
      enableSorting: false,
      cell: ({ row }) => (
        <div className="flex flex-col gap-1">
          <span>{progress(row.original, zone)}</span>
          {row.original.lastError && row.original.status !== 'sent' && (
            <span className="text-sm break-words text-clay-700">Last error: {row.original.lastError}</span>
          )}
        </div>
      ),
    },
    {
      id: 'action',
      header: 'Action',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) =>
        row.original.status === 'failed' ? (
          <Button variant="secondary" loading={busyId === row.original.id} onClick={() => resend(row.original)}>
            Resend<span className="sr-only"> to {row.original.to}</span>
          </Button>
        ) : null,
    },
  ];
}

export interface OutgoingMailPageProps {
  clubId: number;
  clubName: string;
}

/** Coordinators' outgoing mail: every e-mail the club's changes wrote, failed first, with a Resend button. */
export function OutgoingMailPage({ clubId, clubName }: OutgoingMailPageProps) {
  const [params, setParams] = useSearchParams();
  const status = readStatus(params.get('status'));
  const outbox = useOutbox(clubId, { status, page: 1 });
  const resend = useResendMail(clubId);
  const zone = useTimeZone();
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);

  const setStatus = (value: string) => {
    const next = new URLSearchParams(params);
    if (value && value !== 'all') next.set('status', value);
    else next.delete('status');
    setParams(next, { replace: true });
  };

  const onResend = (m: OutboxMessage) => {
    setNotice(null);
    resend.mutate(m.id, {
      onSuccess: () => setNotice({ tone: 'success', text: `The message to ${m.to} is waiting to send again.` }),
      onError: (err) => setNotice({ tone: 'error', text: err.message }),
    });
  };

  const data = outbox.data;
  return (
    <>
      <title>{`Outgoing mail · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Outgoing mail"
        description="Every e-mail the club sends is kept here first and tried again if the mail server cannot take it: after a minute, then waiting twice as long each time. After 8 tries it shows as failed, and you can resend it."
        actions={
          <Link to={paths.mailTemplates(clubId)} className={buttonClasses('secondary')}>
            E-mail templates
          </Link>
        }
      />
      <div className="flex flex-col gap-6">
        <Select label="Show" value={status} onChange={(e) => setStatus(e.target.value)} className="sm:w-56">
          {(['all', ...outboxStatuses] as const).map((s) => (
            <option key={s} value={s}>
              {filterLabels[s]}
            </option>
          ))}
        </Select>
        {notice && <Alert tone={notice.tone}>{notice.text}</Alert>}
        {data && data.failed > 0 && status !== 'failed' && (
          <Alert tone="warning" title={`${data.failed} ${data.failed === 1 ? 'message' : 'messages'} could not be sent`}>
            Check the address and the last error, then resend.
          </Alert>
        )}
        {outbox.isPending ? (
          <LoadingState label="Loading outgoing mail…" />
        ) : outbox.isError ? (
          <ErrorState
            message={outbox.error.message}
            requestId={isApiError(outbox.error) ? outbox.error.requestId : undefined}
            onRetry={() => void outbox.refetch()}
            retrying={outbox.isFetching}
          />
        ) : (
          <>
            <DataTable
              data={outbox.data.items}
              columns={columns(onResend, resend.isPending ? (resend.variables ?? null) : null, zone)}
              caption="Outgoing mail"
              filterLabel="Filter outgoing mail"
              emptyMessage={status === 'all' ? 'No e-mail has gone out from this club yet.' : `No mail is ${filterLabels[status].toLowerCase()}.`}
              pageSizes={[10, 25, 50]}
              getRowId={(m) => String(m.id)}
            />
            {outbox.data.total > outbox.data.items.length && (
              <p className="text-sm text-stone">
                Showing the newest {outbox.data.items.length} of {outbox.data.total}.
              </p>
            )}
          </>
        )}
      </div>
    </>
  );
}
