import { useEffect, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Send } from 'lucide-react';
import { z } from 'zod';
import { MailingCreateBodySchema, type MailingAudience, type MailingCreateBody, type MailingSent } from '@shared/schemas/mailings';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useSendMailing } from '../api/send-mailing';
import { useMailingAudience } from '../api/get-mailing-audience';
import { plural } from '@/lib/format';

// The form keeps the audience flat (a kind, a year, a site) and builds the API's audience on submit.
const FormSchema = z
  .object({
    subject: MailingCreateBodySchema.shape.subject,
    body: MailingCreateBodySchema.shape.body,
    kind: z.enum(['all_members', 'season', 'site']),
    year: z.number('A year like 2027').int('A year like 2027').min(2000, 'A year like 2027').max(2100, 'A year like 2027'),
    siteId: z.number().int().nullable(),
  })
  .refine((v) => v.kind !== 'site' || v.siteId !== null, { path: ['siteId'], message: 'Choose a site' });
type FormValues = z.infer<typeof FormSchema>;

function audienceOf(v: FormValues): MailingAudience {
  if (v.kind === 'season') return { kind: 'season', year: v.year };
  if (v.kind === 'site') return { kind: 'site', siteId: v.siteId!, year: v.year };
  return { kind: 'all_members' };
}

function audienceText(a: MailingAudience, sites: Array<{ id: number; name: string }>): string {
  if (a.kind === 'season') return `everyone holding a plot in ${a.year}`;
  if (a.kind === 'site') return `everyone holding a plot at ${sites.find((s) => s.id === a.siteId)?.name ?? 'the site'} in ${a.year}`;
  return 'everyone in the club';
}

const kinds = [
  { value: 'all_members', label: 'Everyone in the club', hint: 'Plot holders, volunteers and coordinators.' },
  { value: 'season', label: 'Plot holders of a season', hint: 'Everyone with a plot that year.' },
  { value: 'site', label: 'Plot holders at one site', hint: 'Everyone with a plot there that year.' },
] as const;

/** Writes a club message, says who it goes to, and sends it after one confirmation. */
export function MailingForm({ clubId, sites }: { clubId: number; sites: Array<{ id: number; name: string }> }) {
  const send = useSendMailing(clubId);
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState<MailingCreateBody | null>(null);
  const [sent, setSent] = useState<MailingSent | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    subscribe,
    formState: { errors },
  } = useForm<FormValues>({
    resolver: zodResolver(FormSchema),
    defaultValues: { subject: '', body: '', kind: 'all_members', year: new Date().getFullYear(), siteId: null },
  });
  const kind = useWatch({ control, name: 'kind' });
  const count = useMailingAudience(clubId, pending?.audience ?? null);
  const reach = count.data;
  // Any edit after "Review" means reviewing again, so what is confirmed is what is sent.
  useEffect(() => subscribe({ formState: { values: true }, callback: () => setPending(null) }), [subscribe]);

  const onReview = handleSubmit((values) => {
    setFormError(null);
    setSent(null);
    setPending({ subject: values.subject, body: values.body, audience: audienceOf(values) });
  });

  const onSend = () => {
    if (!pending) return;
    send.mutate(pending, {
      onSuccess: (result) => {
        setSent(result);
        setPending(null);
        reset({ subject: '', body: '', kind: 'all_members', year: new Date().getFullYear(), siteId: null });
      },
      onError: (error) => {
        setPending(null);
        setFormError(applyServerErrors(error, setError, ['subject', 'body']));
      },
    });
  };

  return (
    <form onSubmit={onReview} noValidate className="flex flex-col gap-5">
      {sent && (
        <Alert tone="success" title="Message sent">
          {sent.recipients === 0
            ? 'Nobody was in that audience, so nothing was sent.'
            : `On its way to ${sent.sent} of ${sent.recipients} ${sent.recipients === 1 ? 'person' : 'people'}, each in their own e-mail.`}
          {sent.skipped > 0 && ` ${sent.skipped} turned club news off and were skipped.`}
          {sent.recipients > 0 && ' The list below counts each copy once the mail server takes it; any it cannot take appear on Outgoing mail.'}
        </Alert>
      )}
      {formError && <Alert tone="error">{formError}</Alert>}

      <fieldset>
        <legend className="mb-1 font-medium">Send to</legend>
        <div className="flex flex-col gap-1">
          {kinds.map((k) => (
            <label key={k.value} className="flex min-h-11 cursor-pointer items-start gap-3 py-1">
              <input type="radio" value={k.value} className="mt-1 size-5 accent-leaf" {...register('kind')} />
              <span>
                <span className="font-medium">{k.label}</span>
                <span className="block text-sm text-stone">{k.hint}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      {kind !== 'all_members' && (
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="Season"
            type="number"
            inputMode="numeric"
            error={errors.year?.message}
            {...register('year', { valueAsNumber: true })}
          />
          {kind === 'site' && (
            <Select
              label="Site"
              error={errors.siteId?.message}
              {...register('siteId', { setValueAs: (v: unknown) => (v === '' || v === null ? null : Number(v)) })}
            >
              <option value="">Choose a site</option>
              {sites.map((site) => (
                <option key={site.id} value={site.id}>
                  {site.name}
                </option>
              ))}
            </Select>
          )}
        </div>
      )}
      <TextField label="Subject" autoComplete="off" error={errors.subject?.message} {...register('subject')} />
      <TextAreaField label="Message" hint="Plain text. Leave a blank line between paragraphs. Each e-mail starts with the person's name and ends with why they got it." error={errors.body?.message} rows={8} {...register('body')} />

      {pending ? (
        <Alert tone="warning" title="Ready to send">
          <p>
            “{pending.subject}” goes to {audienceText(pending.audience, sites)}. Each person gets their own e-mail; people who
            turned club news off are skipped.
          </p>
          <p className="mt-2 font-medium" aria-live="polite">
            {count.isPending
              ? 'Counting who it reaches…'
              : count.isError
                ? 'The number of people could not be counted just now; the message can still be sent.'
                : reach!.recipients + reach!.skipped === 0
                  ? 'Nobody is in that audience at the moment.'
                  : `It will reach ${plural(reach!.recipients, 'person', 'people')}${reach!.skipped > 0 ? `; ${reach!.skipped} turned club news off and will be skipped` : ''}.`}
          </p>
          <div className="mt-3 flex flex-wrap gap-3">
            <Button
              onClick={onSend}
              loading={send.isPending}
              loadingText="Sending…"
              disabled={count.isPending || reach?.recipients === 0}
            >
              <Send className="size-5" aria-hidden="true" />
              {reach && reach.recipients > 0 ? `Send to ${plural(reach.recipients, 'person', 'people')}` : 'Send now'}
            </Button>
            <Button variant="secondary" onClick={() => setPending(null)} disabled={send.isPending}>
              Change something
            </Button>
          </div>
        </Alert>
      ) : (
        <Button type="submit" className="self-start">
          Review and send
        </Button>
      )}
    </form>
  );
}
