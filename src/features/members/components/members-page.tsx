import { UserPlus } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useInvites } from '../api/get-invites';
import { useMembers } from '../api/get-members';
import { InviteForm } from './invite-form';
import { InvitesTable } from './invites-table';
import { MembersImport } from './members-import';
import { MembersTable } from './members-table';
import { CoordinatorsOnly } from '@/components/coordinators-only';

function PartialNote({ shown, total, noun }: { shown: number; total: number; noun: string }) {
  if (total <= shown) return null;
  return (
    <p className="mb-3 text-sm text-stone">
      Showing the first {shown} of {total} {noun}.
    </p>
  );
}

/** Coordinators' members page: member table, invite form and pending invites. */
export function MembersPage({ clubId, clubName }: { clubId: number; clubName: string }) {
  const members = useMembers(clubId);
  const invites = useInvites(clubId);

  if (isApiError(members.error, 403) || isApiError(invites.error, 403)) {
    return (
      <>
        <title>{`Not allowed · ${clubName} · Tillwell`}</title>
        <CoordinatorsOnly clubId={clubId} page="members" />
      </>
    );
  }

  return (
    <>
      <title>{`Members · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Members"
        description="Everyone in the club, and the people you have invited who haven't joined yet."
        actions={
          <a href="#invite-someone" className={buttonClasses('primary')}>
            <UserPlus className="size-5" aria-hidden="true" />
            Invite someone
          </a>
        }
      />
      <div className="flex flex-col gap-10">
        <PageSection id="club-members" title="Club members">
          {members.isPending ? (
            <LoadingState label="Loading members…" />
          ) : members.isError ? (
            <ErrorState
              message={members.error.message}
              requestId={isApiError(members.error) ? members.error.requestId : undefined}
              onRetry={() => void members.refetch()}
              retrying={members.isFetching}
            />
          ) : (
            <>
              <PartialNote shown={members.data.items.length} total={members.data.total} noun="members" />
              <MembersTable clubId={clubId} members={members.data.items} />
            </>
          )}
        </PageSection>

        <PageSection id="pending-invites" title="Pending invites">
          {invites.isPending ? (
            <LoadingState label="Loading invites…" />
          ) : invites.isError ? (
            <ErrorState
              message={invites.error.message}
              requestId={isApiError(invites.error) ? invites.error.requestId : undefined}
              onRetry={() => void invites.refetch()}
              retrying={invites.isFetching}
            />
          ) : (
            <>
              <PartialNote shown={invites.data.items.length} total={invites.data.total} noun="invites" />
              <InvitesTable clubId={clubId} invites={invites.data.items} />
            </>
          )}
        </PageSection>

        <PageSection id="invite-someone" title="Invite someone">
          <Card className="max-w-xl">
            <InviteForm clubId={clubId} />
          </Card>
        </PageSection>

        <PageSection id="import-export" title="Import and download">
          <Card>
            <MembersImport clubId={clubId} />
          </Card>
        </PageSection>
      </div>
    </>
  );
}
