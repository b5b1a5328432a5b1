import { CircleCheck, Sprout } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/fees/compute';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useAnswerLink, useLinkPreview, type LinkKind, type LinkRef } from '../api/answer-link';
import { formatDateTime } from '@/lib/format';

const words = {
  offer: {
    title: 'A plot for you',
    yes: 'Accept the plot',
    no: 'Decline',
    yesBusy: 'Accepting…',
    confirm: { yes: 'Accept this plot?', no: 'Decline this plot?' },
    instead: { yes: 'Decline it instead', no: 'Accept it instead' },
    param: { yes: 'accept', no: 'decline' },
  },
  renewal: {
    title: 'Keep your plot?',
    yes: 'Keep my plot',
    no: 'Give it up',
    yesBusy: 'Saving…',
    confirm: { yes: 'Keep your plot?', no: 'Give up your plot?' },
    instead: { yes: 'Give it up instead', no: 'Keep it instead' },
    param: { yes: 'keep', no: 'release' },
  },
} as const;

export type LinkAnswer = 'yes' | 'no';

/** The answer a link from the e-mail already carries (`answer=accept`), if any. */
export function answerOf(kind: LinkKind, param: string | null): LinkAnswer | undefined {
  const w = words[kind].param;
  return param === w.yes ? 'yes' : param === w.no ? 'no' : undefined;
}

/**
 * The page an offer or renewal e-mail opens (by its token), and the club home's renewal link opens
 * for the signed-in holder (by the renewal's id): the plot, the fee and the deadline, with the two answers.
 */
export function LinkResponse({ kind, linkRef, chosen }: { kind: LinkKind; linkRef: LinkRef | null; chosen?: LinkAnswer }) {
  const ref = linkRef ?? { token: '' };
  const preview = useLinkPreview(kind, ref);
  const answer = useAnswerLink(kind, ref);
  const w = words[kind];

  if (!linkRef) return <ErrorState headingLevel="h1" title="This link is incomplete" message="Open the link from the e-mail again, or copy all of it." />;
  if (preview.isPending) return <LoadingState label="Opening your link…" />;
  if (preview.isError) {
    if (isApiError(preview.error, 401)) {
      return <ErrorState headingLevel="h1" title="Please sign in first" message="Sign in, then open the renewal from your club's home page, or use the link in the e-mail." />;
    }
    return (
      // A link cut short or made up (400) or unknown (404) is simply not a valid link.
      <ErrorState
        headingLevel="h1"
        title={isApiError(preview.error, 404) || isApiError(preview.error, 400) ? 'This link is not valid' : 'This link cannot be used'}
        message={
          isApiError(preview.error, 404) || isApiError(preview.error, 400)
            ? 'It may have been cut short when it was copied. Open the link from the e-mail again, or copy all of it.'
            : preview.error.message
        }
      />
    );
  }
  const p = preview.data;
  if (answer.isSuccess) {
    return (
      <div className="space-y-3 text-center">
        <CircleCheck className="mx-auto size-10 text-leaf" aria-hidden="true" />
        <h1 className="text-2xl font-bold">{answer.data.status === 'accepted' || answer.data.status === 'kept' ? 'Done — see you at the plot' : 'Thank you'}</h1>
        <p>{answer.data.message}</p>
      </div>
    );
  }
  const answered = p.status !== 'pending';
  return (
    <div className="space-y-4">
      <p className="flex items-center gap-2 font-semibold text-leaf">
        <Sprout className="size-5" aria-hidden="true" /> {p.clubName}
      </p>
      <h1 className="text-2xl font-bold">{chosen && !answered ? w.confirm[chosen] : w.title}</h1>
      <p>
        Hello {p.name}. {kind === 'offer' ? 'This plot is offered to you' : 'You can keep this plot'} for the {p.year} season:
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="text-stone">Plot</dt>
        <dd className="font-semibold">{p.plot.label}, {p.plot.siteName}</dd>
        <dt className="text-stone">Size</dt>
        <dd>{p.plot.size} ({p.plot.area}), {p.plot.kind.toLowerCase()}</dd>
        {p.fee && (
          <>
            <dt className="text-stone">Fee</dt>
            <dd>
              {formatMoney(p.fee.plotFeeMinor, p.fee.currency)}
              {p.fee.depositMinor > 0 && ` plus a refundable deposit of ${formatMoney(p.fee.depositMinor, p.fee.currency)}`}
            </dd>
          </>
        )}
        <dt className="text-stone">Answer by</dt>
        <dd>{formatDateTime(p.deadline, p.timeZone)}</dd>
      </dl>
      {answered ? (
        <Alert tone="info">This has already been answered ({p.status}). Nothing more to do.</Alert>
      ) : (
        <>
          {answer.isError && <Alert tone="error">{answer.error.message}</Alert>}
          <div className="flex flex-wrap items-center gap-3">
            {chosen !== 'no' && (
              <Button onClick={() => answer.mutate('yes')} loading={answer.isPending && answer.variables === 'yes'} loadingText={w.yesBusy} disabled={answer.isPending}>
                {w.yes}
              </Button>
            )}
            {chosen !== 'yes' && (
              <Button
                variant={chosen === 'no' ? 'primary' : 'secondary'}
                onClick={() => answer.mutate('no')}
                loading={answer.isPending && answer.variables === 'no'}
                loadingText="Saving…"
                disabled={answer.isPending}
              >
                {w.no}
              </Button>
            )}
            {chosen && (
              <Link to={`?${'token' in ref ? `token=${encodeURIComponent(ref.token)}` : `renewal=${ref.renewalId}`}&answer=${w.param[chosen === 'yes' ? 'no' : 'yes']}`} className="text-water underline">
                {w.instead[chosen]}
              </Link>
            )}
          </div>
        </>
      )}
    </div>
  );
}
