import { Link } from 'react-router-dom';
import { MailX, Sprout } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useMailStop, useStopMail } from '../api/stop-mail';

/**
 * An e-mail's stop link, opened in a browser: says what it turns off and asks before doing it (mail
 * scanners open links). No sign-in; the token is the key. Mail clients' one-click POSTs the same address.
 */
export function StopMailPage({ token }: { token: string | null }) {
  const preview = useMailStop(token ?? '');
  const stop = useStopMail(token ?? '');

  if (!token) return <ErrorState headingLevel="h1" title="This link is incomplete" message="Open the link from the e-mail again, or copy all of it." />;
  if (preview.isPending) return <LoadingState label="Opening your link…" />;
  if (preview.isError) {
    const notOurs = isApiError(preview.error, 404);
    return (
      <ErrorState
        headingLevel="h1"
        title={notOurs ? 'This link is not valid' : 'This link could not be opened'}
        message={notOurs ? 'It may have been cut short when it was copied. Open the link from the newest e-mail, or sign in and change your e-mail choices.' : preview.error.message}
        onRetry={notOurs ? undefined : () => void preview.refetch()}
        retrying={preview.isFetching}
      />
    );
  }

  const p = preview.data;
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-1">
        <p className="flex items-center gap-2 font-semibold text-leaf">
          <Sprout className="size-5" aria-hidden="true" /> {p.clubName}
        </p>
        {p.forName && <p className="text-sm text-stone">This link is for {p.forName}. If that is not you, ask the club for your own.</p>}
      </div>
      {p.state === 'used' ? (
        <>
          <h1 className="text-2xl font-bold">You will not get {p.what} any more</h1>
          <Alert tone="success">
            {stop.isSuccess ? 'Done.' : 'This link was used already.'} Messages about your own plot, payments and the places you take are still sent.
          </Alert>
        </>
      ) : (
        <>
          <h1 className="text-2xl font-bold">Stop {p.what}?</h1>
          <p>
            You will no longer get {p.what} from {p.clubName}. Messages about your own plot, payments and the places you take are still sent.
          </p>
          {stop.isError && <Alert tone="error">{stop.error.message}</Alert>}
          <Button className="min-h-12 self-start text-lg" loading={stop.isPending} loadingText="Stopping…" onClick={() => stop.mutate()}>
            <MailX className="size-5" aria-hidden="true" /> Stop these e-mails
          </Button>
        </>
      )}
      <p className="text-sm text-stone">
        To turn it back on, <Link to={paths.signIn()} className="text-water underline">sign in</Link> and open your e-mail choices in the club.
      </p>
    </div>
  );
}
