import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Lock } from 'lucide-react';
import { MailPreferencesBodySchema, type MailPreferences } from '@shared/schemas/mailings';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useMailPreferences } from '../api/get-mail-preferences';
import { useUpdateMailPreferences } from '../api/update-mail-preferences';

const alwaysSent = [
  'Offers of a plot from the waiting list, and their deadlines',
  'Renewal of your plot for the next season',
  'Fees due and receipts for payments',
  'Invitations and password reset links',
  'Your waiting list confirmation',
];

function ChoicesForm({ clubId, clubName, saved }: { clubId: number; clubName: string; saved: MailPreferences }) {
  const update = useUpdateMailPreferences(clubId);
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { isDirty },
    reset,
  } = useForm({ resolver: zodResolver(MailPreferencesBodySchema), defaultValues: saved });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setDone(false);
    update.mutate(values, {
      onSuccess: (next) => {
        reset(next);
        setDone(true);
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, ['clubNews'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {done && <Alert tone="success">Saved. Your choice applies to {clubName} only.</Alert>}
      {formError && <Alert tone="error">{formError}</Alert>}
      <Checkbox
        label="Club news from the coordinator"
        hint="Work days, water and gate notices, events and other messages the coordinator sends to everyone."
        {...register('clubNews', { onChange: () => setDone(false) })}
      />
      <Button type="submit" loading={update.isPending} loadingText="Saving…" disabled={!isDirty} className="self-start">
        Save my choice
      </Button>
    </form>
  );
}

/** Everyone's own e-mail choices in a club: club news can be turned off; messages about their plot cannot. */
export function EmailChoicesPage({ clubId, clubName }: { clubId: number; clubName: string }) {
  const prefs = useMailPreferences(clubId);
  return (
    <>
      <title>{`E-mail choices · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="E-mail choices"
        description="Choose which optional e-mails you get from this club."
      />
      <div className="grid max-w-3xl gap-6">
        <Card>
          <h2 className="mb-3 text-lg font-semibold">Optional</h2>
          {prefs.isPending ? (
            <LoadingState label="Loading your choices…" />
          ) : prefs.isError ? (
            <ErrorState
              message={prefs.error.message}
              requestId={isApiError(prefs.error) ? prefs.error.requestId : undefined}
              onRetry={() => void prefs.refetch()}
              retrying={prefs.isFetching}
            />
          ) : (
            <ChoicesForm clubId={clubId} clubName={clubName} saved={prefs.data} />
          )}
        </Card>
        <Card>
          <h2 className="mb-1 flex items-center gap-2 text-lg font-semibold">
            <Lock className="size-5 text-stone" aria-hidden="true" />
            Always sent
          </h2>
          <p className="mb-3 text-stone">
            These are about your own plot, place or account and need an answer or keep a record, so they cannot be turned
            off:
          </p>
          <ul className="list-disc space-y-1 pl-5">
            {alwaysSent.map((item) => (
              <li key={item}>{item}</li>
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}
