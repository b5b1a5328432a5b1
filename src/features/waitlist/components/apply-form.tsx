import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  ApplicationBodySchema,
  preferredSizeLabels,
  preferredSizes,
  type ApplyInfo,
} from '@shared/schemas/applications';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Checkbox, CheckboxGroup } from '@/components/ui/checkbox';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useSubmitApplication } from '../api/submit-application';

const fieldNames = [
  'name',
  'email',
  'phone',
  'preferredSize',
  'needsAccessible',
  'needsRaised',
  'preferredSiteId',
  'notes',
] as const;

export interface ApplyFormProps {
  slug: string;
  info: ApplyInfo;
  onApplied: (receipt: { position: number; message: string }) => void;
}

/** The public "apply for a plot" form; a hidden honeypot field catches form-filling bots. */
export function ApplyForm({ slug, info, onApplied }: ApplyFormProps) {
  const submit = useSubmitApplication(slug);
  const ids = useId();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ApplicationBodySchema),
    defaultValues: {
      name: '',
      email: '',
      phone: '',
      preferredSize: 'any',
      needsAccessible: false,
      needsRaised: false,
      preferredSiteId: null,
      notes: '',
      website: '',
    },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    submit.mutate(values, {
      onSuccess: onApplied,
      onError: (error) => setFormError(applyServerErrors(error, setError, fieldNames)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label="E-mail"
        type="email"
        inputMode="email"
        autoComplete="email"
        hint="Offers of a plot come by e-mail, so use one you read."
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Phone (optional)"
        type="tel"
        autoComplete="tel"
        error={errors.phone?.message}
        {...register('phone')}
      />
      <Select label="Size of plot you would like" error={errors.preferredSize?.message} {...register('preferredSize')}>
        {preferredSizes.map((size) => (
          <option key={size} value={size}>
            {preferredSizeLabels[size]}
          </option>
        ))}
      </Select>
      <CheckboxGroup legend="Anything you need from the plot?">
        <Checkbox
          label="A raised bed"
          hint="Waist-high or knee-high beds, for less bending."
          {...register('needsRaised')}
        />
        <Checkbox
          label="A wheelchair-accessible bed"
          hint="Reachable from a firm, level path."
          {...register('needsAccessible')}
        />
      </CheckboxGroup>
      {info.sites.length > 0 && (
        <Select
          label="Preferred site (optional)"
          error={errors.preferredSiteId?.message}
          {...register('preferredSiteId', { setValueAs: (v: unknown) => (v === '' || v === null ? null : Number(v)) })}
        >
          <option value="">No preference</option>
          {info.sites.map((site) => (
            <option key={site.id} value={site.id}>
              {site.name}
            </option>
          ))}
        </Select>
      )}
      <TextAreaField label="Anything else the coordinator should know? (optional)" error={errors.notes?.message} rows={3} {...register('notes')} />
      {/* People never see or reach this field; bots that fill every input do, and are quietly ignored. */}
      <div aria-hidden="true" className="absolute -left-[9999px] h-px w-px overflow-hidden">
        <label htmlFor={`${ids}-website`}>Website</label>
        <input id={`${ids}-website`} type="text" tabIndex={-1} autoComplete="off" {...register('website')} />
      </div>
      <Button type="submit" loading={submit.isPending} loadingText="Sending…">
        Join the waiting list
      </Button>
      <p className="text-sm text-stone">
        {info.clubName} uses your details only to run its waiting list and offer you a plot.
      </p>
    </form>
  );
}
