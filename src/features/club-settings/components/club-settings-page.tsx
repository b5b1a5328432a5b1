import type { ReactNode } from 'react';
import type { ClubSettings } from '@shared/schemas/clubs';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { useClubSettings } from '../api/get-club-settings';
import { ClubSettingsForm } from './club-settings-form';
import { CoordinatorsOnly } from '@/components/coordinators-only';

export interface ClubSettingsPageProps {
  clubId: number;
  clubName: string;
  onSaved?: (settings: ClubSettings) => void;
  /** More sections for the page, given the loaded settings (the app adds the fee schedule here). */
  children?: (settings: ClubSettings) => ReactNode;
}

/** Coordinators' settings page: the club's own rules, then whatever sections the app adds. */
export function ClubSettingsPage({ clubId, clubName, onSaved, children }: ClubSettingsPageProps) {
  const settings = useClubSettings(clubId);
  if (isApiError(settings.error, 403)) return <CoordinatorsOnly clubId={clubId} page="settings" />;
  return (
    <>
      <title>{`Settings · ${clubName} · Tillwell`}</title>
      <PageHeader eyebrow={clubName} title="Settings" description="The club's name, how the spring round runs, and what plots cost." />
      {settings.isPending ? (
        <LoadingState label="Loading settings…" />
      ) : settings.isError ? (
        <ErrorState
          message={settings.error.message}
          requestId={isApiError(settings.error) ? settings.error.requestId : undefined}
          onRetry={() => void settings.refetch()}
          retrying={settings.isFetching}
        />
      ) : (
        <div className="flex flex-col gap-10">
          <section aria-labelledby="club-rules" className="min-w-0">
            <h2 id="club-rules" className="mb-4 text-xl font-semibold">
              Club and spring round
            </h2>
            <Card>
              <ClubSettingsForm key={settings.data.id} settings={settings.data} onSaved={onSaved} />
            </Card>
          </section>
          {children?.(settings.data)}
        </div>
      )}
    </>
  );
}
