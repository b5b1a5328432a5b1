import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Check } from 'lucide-react';
import type { ShiftDoneBody } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, inputClasses, TextAreaField, TextField } from '@/components/ui/field';
import { ApiError, isApiError } from '@/lib/api/client';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { DoneFormSchema, doneFormDefaults, photoProblem, PHOTO_TYPES, type DoneFormValues } from '../lib/done-form';
import { hoursText } from '../lib/words';

export interface DoneFormProps {
  /** The shift's estimate, the hours box's first value. */
  estHours: number;
  /** Sends the form; a rejection keeps everything typed and shows the server's words. */
  onSubmit: (body: ShiftDoneBody, photo: File | null) => Promise<unknown>;
  submitLabel?: string;
  onCancel?: () => void;
}

/** "How did it go?": a note, the hours (the estimate unless changed) and an optional photo. */
export function DoneForm({ estHours, onSubmit, submitLabel = 'Mark the shift done', onCancel }: DoneFormProps) {
  const photoId = `${useId()}-photo`;
  const [photo, setPhoto] = useState<File | null>(null);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<DoneFormValues, unknown, ShiftDoneBody>({ resolver: zodResolver(DoneFormSchema), defaultValues: doneFormDefaults(estHours) });

  const submit = handleSubmit(async (body) => {
    setFormError(null);
    const problem = photoProblem(photo);
    if (problem) {
      setPhotoError(problem);
      return;
    }
    try {
      await onSubmit(body, photo);
    } catch (error) {
      // The photo's own message goes beside the photo; the rest beside their boxes or above the form.
      let rest: unknown = error;
      const photoMessage = isApiError(error) ? error.fields?.photo : undefined;
      if (isApiError(error) && photoMessage) {
        setPhotoError(photoMessage);
        const { photo: _photo, ...fields } = error.fields ?? {};
        rest = new ApiError({ status: error.status, code: error.code, message: error.message, fields, requestId: error.requestId });
      }
      const text = applyServerErrors(rest, setError, ['note', 'hours']);
      setFormError(text && text !== photoMessage ? text : null);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextAreaField
        label="A note for the coordinator (optional)"
        hint="What you did, and anything that needs a look."
        rows={3}
        maxLength={1000}
        error={errors.note?.message}
        {...register('note')}
      />
      <TextField
        label="Hours you worked"
        hint={`The shift was planned for ${hoursText(estHours)}. Change it if yours was different, or leave it empty to count the plan.`}
        inputMode="decimal"
        autoComplete="off"
        error={errors.hours?.message}
        {...register('hours')}
      />
      <Field label="A photo (optional)" hint="A JPEG, PNG or WebP of up to 8 MB, such as the beds afterwards." error={photoError ?? undefined} id={photoId}>
        {({ inputId, describedBy, invalid }) => (
          <input
            id={inputId}
            type="file"
            accept={PHOTO_TYPES.join(',')}
            aria-describedby={describedBy}
            aria-invalid={invalid || undefined}
            className={`${inputClasses} cursor-pointer file:mr-3 file:rounded-md file:border-0 file:bg-paper-100 file:px-3 file:py-1 file:font-medium file:text-soil`}
            onChange={(event) => {
              const file = event.target.files?.[0] ?? null;
              setPhoto(file);
              setPhotoError(photoProblem(file));
            }}
          />
        )}
      </Field>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" className="min-h-12 px-6 text-lg" loading={isSubmitting} loadingText="Saving…">
          <Check className="size-5" aria-hidden="true" />
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="ghost" onClick={onCancel} disabled={isSubmitting}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
