import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useMailings } from '../api/get-mailings';
import { MailingForm } from './mailing-form';
import { MailingsTable } from './mailings-table';

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="min-w-0">
      <h2 id={id} className="mb-4 text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

export interface MessagesPageProps {
  clubId: number;
  clubName: string;
  sites: Array<{ id: number; name: string }>;
}

/** The coordinator's messages: write one to the club, a season's holders or one site's, and see what was sent. */
export function MessagesPage({ clubId, clubName, sites }: MessagesPageProps) {
  const mailings = useMailings(clubId);
  return (
    <>
      <title>{`Messages · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="Messages"
        description="Club news by e-mail. Each person gets their own copy, and anyone who turned club news off is skipped."
      />
      <div className="grid gap-10 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <Section id="write-message" title="Write a message">
          <Card>
            <MailingForm clubId={clubId} sites={sites} />
          </Card>
        </Section>
        <Section id="sent-messages" title="Sent">
          {mailings.isPending ? (
            <LoadingState label="Loading sent messages…" />
          ) : mailings.isError ? (
            <ErrorState
              message={mailings.error.message}
              requestId={isApiError(mailings.error) ? mailings.error.requestId : undefined}
              onRetry={() => void mailings.refetch()}
              retrying={mailings.isFetching}
            />
          ) : (
            <MailingsTable mailings={mailings.data.items} />
          )}
        </Section>
      </div>
    </>
  );
}
