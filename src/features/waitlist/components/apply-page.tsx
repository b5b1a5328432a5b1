import { useState } from 'react';
import { CircleCheck, SearchX } from 'lucide-react';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useApplyInfo } from '../api/get-apply-info';
import { ApplyForm } from './apply-form';

function Receipt({ clubName, position, message }: { clubName: string; position: number; message: string }) {
  return (
    <div className="flex flex-col gap-4" role="status">
      <div className="flex items-center gap-3">
        <CircleCheck className="size-8 shrink-0 text-leaf" aria-hidden="true" />
        <h1 className="text-2xl font-bold">You're on the waiting list</h1>
      </div>
      <p className="rounded-xl bg-leaf-50 p-4 text-center">
        <span className="block text-sm font-semibold tracking-wide text-leaf-800 uppercase">Your place</span>
        <span className="block text-5xl font-bold text-leaf-800 tabular-nums">{position}</span>
      </p>
      <p>{message}</p>
      <h2 className="text-lg font-semibold">What happens next</h2>
      <ul className="list-disc space-y-1 pl-5 text-stone">
        <li>Each spring, last season's plot holders renew first.</li>
        <li>Plots still free are then offered to the waiting list in order.</li>
        <li>When it is your turn you get an e-mail with a link to accept or decline, and a few days to answer.</li>
      </ul>
      <p className="text-sm text-stone">You can close this page. {clubName} has your details.</p>
    </div>
  );
}

/** The public page where someone asks for a plot at a club and sees their place on the waiting list. */
export function ApplyPage({ slug }: { slug: string }) {
  const info = useApplyInfo(slug);
  const [receipt, setReceipt] = useState<{ position: number; message: string } | null>(null);

  if (info.isPending) return <LoadingState label="Loading the form…" />;
  if (isApiError(info.error, 404)) {
    return (
      <>
        <title>Club not found · Tillwell</title>
        <EmptyState icon={SearchX} title="We couldn't find that club" headingLevel="h1">
          <p>The link may be mistyped or out of date. Ask the club for the address of its application form.</p>
        </EmptyState>
      </>
    );
  }
  if (info.isError) {
    return (
      <ErrorState
        message={info.error.message}
        requestId={isApiError(info.error) ? info.error.requestId : undefined}
        onRetry={() => void info.refetch()}
        retrying={info.isFetching}
      />
    );
  }

  const { clubName, feeNote, typicalWait } = info.data;
  return (
    <>
      <title>{`Apply for a plot · ${clubName} · Tillwell`}</title>
      {receipt ? (
        <Receipt clubName={clubName} {...receipt} />
      ) : (
        <div className="relative flex flex-col gap-6">
          <div>
            <p className="text-sm font-semibold tracking-wide text-leaf uppercase">{clubName}</p>
            <h1 className="text-2xl font-bold">Apply for a plot</h1>
            <p className="mt-1 text-stone">
              Join the waiting list. We e-mail you your place straight away, and again when a plot is free for you.
            </p>
          </div>
          {(feeNote || typicalWait) && (
            <dl className="grid gap-3 rounded-xl border border-paper-200 bg-white p-4 sm:grid-cols-2">
              {feeNote && (
                <div>
                  <dt className="text-sm font-semibold text-stone">What a plot costs</dt>
                  <dd>{feeNote}</dd>
                </div>
              )}
              {typicalWait && (
                <div>
                  <dt className="text-sm font-semibold text-stone">How long people wait</dt>
                  <dd>{typicalWait}</dd>
                </div>
              )}
            </dl>
          )}
          <ApplyForm slug={slug} info={info.data} onApplied={setReceipt} />
        </div>
      )}
    </>
  );
}
