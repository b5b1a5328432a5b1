import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Link2Off } from 'lucide-react';
import { ClubSignupTokenSchema, type ClubSignupResult } from '@shared/schemas/club-signups';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError, type ApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useClubSignupCheck, useConfirmClubSignup } from '../api/club-signup';

function Problem({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <EmptyState
      icon={Link2Off}
      title={title}
      headingLevel="h1"
      action={
        <Link to={'/start-a-club'} className={buttonClasses('primary')}>
          Start a club again
        </Link>
      }
    >
      {children}
    </EmptyState>
  );
}

/** The designed dead ends: a link we never sent, one already used (410 "used"), one expired (410 "expired"). */
function LinkProblem({ error }: { error: ApiError | null }) {
  if (error && error.status === 410 && error.fields?.token === 'used') {
    return (
      <Problem title="This link has already been used">
        <p>The club was made the first time the link was followed. Sign in to open it.</p>
        <p>
          <Link to={paths.signIn()} className="underline">
            Go to sign in
          </Link>
        </p>
      </Problem>
    );
  }
  if (error && error.status === 410) {
    return (
      <Problem title="This link has expired">
        <p>Sign-up links work for a day. Fill in the form again and we will send a fresh one.</p>
      </Problem>
    );
  }
  return (
    <Problem title="This link doesn't work">
      <p>It may have been cut short when it was copied. Open it from the e-mail again, or start over.</p>
    </Problem>
  );
}

function Made({ result }: { result: ClubSignupResult }) {
  return (
    <div className="flex flex-col gap-4" role="status">
      <h1 className="text-2xl font-bold">Your club is ready</h1>
      <p>You already have a Tillwell account with this address, so the club was added to it and your password stayed as it was.</p>
      <p>Sign in with your existing password to open the new club.</p>
      <Link to={paths.signIn()} className={buttonClasses('primary')}>
        Sign in
      </Link>
      <span className="sr-only">{`Club number ${result.clubId}`}</span>
    </div>
  );
}

export interface ConfirmClubProps {
  token: string | null;
  /** Called with the new session when a new account was signed in (the app stores it). */
  onSignedIn: (session: { user: NonNullable<ClubSignupResult['user']>; csrfToken: string }) => void;
}

function ConfirmGate({ token, onSignedIn }: { token: string; onSignedIn: ConfirmClubProps['onSignedIn'] }) {
  const check = useClubSignupCheck(token);
  const confirm = useConfirmClubSignup();
  const navigate = useNavigate();
  const [made, setMade] = useState<ClubSignupResult | null>(null);

  if (made) return <Made result={made} />;
  if (check.isPending) return <LoadingState label="Opening your link…" />;
  if (check.isError) {
    if (isApiError(check.error, 404) || isApiError(check.error, 410)) return <LinkProblem error={check.error} />;
    return <ErrorState title="We couldn't open this link" message={check.error.message} onRetry={() => void check.refetch()} retrying={check.isFetching} />;
  }
  if (confirm.isError && (isApiError(confirm.error, 404) || isApiError(confirm.error, 410))) return <LinkProblem error={confirm.error} />;

  const onConfirm = () =>
    confirm.mutate(token, {
      onSuccess: (result) => {
        if (result.user && result.csrfToken) {
          onSignedIn({ user: result.user, csrfToken: result.csrfToken });
          navigate(paths.club(result.clubId), { replace: true });
        } else setMade(result);
      },
    });

  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">Start {check.data.clubName}</h1>
      <p>
        The address <strong className="font-semibold">{check.data.email}</strong> is confirmed. Press the button to set up the club with you as
        its coordinator.
      </p>
      {confirm.isError && <Alert tone="error">{confirm.error.message}</Alert>}
      <Button type="button" onClick={onConfirm} loading={confirm.isPending} loadingText="Setting up…">
        Start {check.data.clubName}
      </Button>
    </div>
  );
}

/** `/start-a-club/confirm?token=…`: opening the link changes nothing until the button is pressed (mail scanners open links). */
export function ConfirmClub({ token, onSignedIn }: ConfirmClubProps) {
  if (!token || !ClubSignupTokenSchema.shape.token.safeParse(token).success) return <LinkProblem error={null} />;
  return <ConfirmGate token={token} onSignedIn={onSignedIn} />;
}
