import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CalendarPlus, Clock, Droplets, Fence, MapPin, Pencil, Timer, UsersRound } from 'lucide-react';
import type { ShiftDetail, ShiftSuggestion } from '@shared/schemas/shifts';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { isApiError } from '@/lib/api/client';
import { useIdempotencyKeys } from '@/lib/api/idempotency';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateShift } from '../api/create-shift';
import { createBodyFromSuggestion, ShiftDetailsFormSchema, shiftFormFieldNames, shiftFormValues, type ShiftDetailsChecked, type ShiftFormValues } from '../lib/shift-form';
import { waterText } from '../lib/units';
import { estimateText, plotsText } from '../lib/words';
import { KindTag } from './kind-tag';
import { ShiftFields } from './shift-fields';

export interface SuggestionCardProps {
  clubId: number;
  suggestion: ShiftSuggestion;
  /** The site's units, for the water (the suggestion does not carry them). */
  units?: 'metric' | 'us';
  onCreated: (shift: ShiftDetail) => void;
}

/**
 * One suggested shift: what it groups (site, kind, time, plots, tasks, hours and how they were
 * estimated). "Create shift" makes it as suggested; "Change first" opens its details to edit.
 */
export function SuggestionCard({ clubId, suggestion: g, units = 'metric', onCreated }: SuggestionCardProps) {
  const titleId = `${useId()}-title`;
  const create = useCreateShift(clubId);
  const keys = useIdempotencyKeys();
  const [editing, setEditing] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ShiftFormValues, unknown, ShiftDetailsChecked>({
    resolver: zodResolver(ShiftDetailsFormSchema),
    defaultValues: shiftFormValues({ ...g, instructions: '' }),
  });

  // The form holds the suggestion's values until changed, so one click creates it as suggested.
  const onSubmit = handleSubmit((details) => {
    setFormError(null);
    const body = createBodyFromSuggestion(g, details);
    create.mutate(
      { body, idempotencyKey: keys.keyFor(body) },
      {
        onSuccess: (shift) => {
          keys.succeeded(body);
          onCreated(shift);
        },
        onError: (error) => {
          // A refusal about a box that is folded away opens the details, so the message is seen beside it.
          if (isApiError(error) && error.fields) setEditing(true);
          setFormError(applyServerErrors(error, setError, shiftFormFieldNames));
        },
      },
    );
  });

  const plots = plotsText(g.plotLabels);
  const water = waterText(g.amountL, units);
  return (
    <article aria-labelledby={titleId} className="flex min-w-0 flex-col gap-3 rounded-xl border border-paper-200 bg-white p-4 shadow-sm">
      <div className="flex flex-wrap items-center gap-2">
        <KindTag kind={g.kind} />
        <span className="text-sm text-stone">{g.taskIds.length === 1 ? '1 open task' : `${g.taskIds.length} open tasks`}</span>
      </div>
      <h3 id={titleId} className="text-lg font-semibold break-words">
        {g.title}
      </h3>
      <ul className="flex flex-col gap-1">
        <li className="flex items-start gap-2">
          <Clock className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
          <span>
            {g.startTime}–{g.endTime} <span className="text-stone">on the site's clock</span>
          </span>
        </li>
        <li className="flex items-start gap-2">
          <MapPin className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
          {g.siteName}
        </li>
        <li className="flex items-start gap-2">
          <UsersRound className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
          {g.capacity === 1 ? '1 place' : `${g.capacity} places`}
        </li>
        <li className="flex items-start gap-2">
          <Timer className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
          <span className="min-w-0">
            {estimateText(g.estHours)}
            {g.estimate && <span className="block text-sm text-stone">{g.estimate}</span>}
          </span>
        </li>
        {plots && (
          <li className="flex items-start gap-2">
            <Fence className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
            <span className="min-w-0 break-words">{plots}</span>
          </li>
        )}
        {water && (
          <li className="flex items-start gap-2">
            <Droplets className="mt-0.5 size-4 shrink-0 text-stone" aria-hidden="true" />
            {water} to give
          </li>
        )}
      </ul>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={`Create ${g.title}`}>
        {formError && <Alert tone="error">{formError}</Alert>}
        {editing && <ShiftFields register={register} errors={errors} show={{}} />}
        <div className="flex flex-wrap gap-3">
          <Button type="submit" loading={create.isPending} loadingText="Creating…">
            <CalendarPlus className="size-5" aria-hidden="true" />
            Create shift
          </Button>
          {!editing && (
            <Button variant="secondary" onClick={() => setEditing(true)} aria-label={`Change ${g.title} first`}>
              <Pencil className="size-5" aria-hidden="true" />
              Change first
            </Button>
          )}
        </div>
      </form>
    </article>
  );
}
