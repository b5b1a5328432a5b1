import { useState } from 'react';
import { useForm, useWatch, type FieldValues } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import {
  cropValueSchemas,
  feedings,
  frostTolerances,
  sowingMethods,
  sunNeeds,
  type OverridableCropField,
} from '@shared/schemas/crops';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useClearCropOverride } from '../api/clear-crop-override';
import { useSetCropOverride } from '../api/set-crop-override';
import { feedingLabels, frostLabels, sowingLabels, sunLabels } from '../lib/format';
import { SourceFields, sourceFormValues, sourceOf, sourcedFormSchema, type SourceKind } from './source-fields';

// The fields a coordinator can give a club value from the crop page, with the inputs each needs. The
// nested values (germination, emergence by temperature, side-dressing, Kc, stages, storage) are left
// to the API for now: each needs a form of its own.

type RangeSpec = { kind: 'range'; unit: string };
type ChoiceSpec = { kind: 'choice'; options: readonly string[]; labels: Record<string, string> };
type MaturitySpec = { kind: 'maturity' };
type FieldSpec = RangeSpec | ChoiceSpec | MaturitySpec;

export const clubValueFields = {
  inRowCm: { kind: 'range', unit: 'cm' },
  betweenRowCm: { kind: 'range', unit: 'cm' },
  equalSpacingCm: { kind: 'range', unit: 'cm' },
  sowingDepthCm: { kind: 'range', unit: 'cm' },
  daysToEmergence: { kind: 'range', unit: 'days' },
  daysToMaturity: { kind: 'maturity' },
  soilPh: { kind: 'range', unit: 'pH' },
  rootingDepthCm: { kind: 'range', unit: 'cm' },
  matureHeightCm: { kind: 'range', unit: 'cm' },
  sowing: { kind: 'choice', options: sowingMethods, labels: sowingLabels },
  sun: { kind: 'choice', options: sunNeeds, labels: sunLabels },
  frost: { kind: 'choice', options: frostTolerances, labels: frostLabels },
  feeding: { kind: 'choice', options: feedings, labels: feedingLabels },
} satisfies Partial<Record<OverridableCropField, FieldSpec>>;

export type ClubValueField = keyof typeof clubValueFields;


// Empty number boxes arrive as NaN (valueAsNumber); the shared schemas then say "Enter a number".
const numberInput = { valueAsNumber: true } as const;

export interface ClubValueProps {
  clubId: number;
  cropId: number;
  field: ClubValueField;
  /** The value's name on the page, e.g. "Days to maturity". */
  term: string;
  current: { value: unknown; source: string; overridden?: true } | undefined;
}

/**
 * "Use a club value" beside one value of a reference crop (coordinators only; the server decides),
 * and "Go back to the reference value" when the club has its own. A refused save keeps the dialog
 * open with what was typed and the server's messages on the inputs.
 */
export function ClubValue({ clubId, cropId, field, term, current }: ClubValueProps) {
  const spec: FieldSpec = clubValueFields[field];
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const [clearError, setClearError] = useState<string | null>(null);
  const save = useSetCropOverride(clubId, cropId);
  const clear = useClearCropOverride(clubId, cropId);
  const schema = sourcedFormSchema(cropValueSchemas[field] as z.ZodType);
  const initial = () => ({ value: current?.value, ...sourceFormValues(current?.overridden ? current.source : undefined) });
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors },
  } = useForm<FieldValues>({ resolver: zodResolver(schema as z.ZodType<FieldValues, FieldValues>), defaultValues: initial() });
  const sourceKind = useWatch({ control, name: 'sourceKind' }) as SourceKind;
  const lower = term.charAt(0).toLowerCase() + term.slice(1);
  const openForm = () => {
    reset(initial());
    setFormError(null);
    setOpen(true);
  };
  const close = () => {
    setOpen(false);
    setFormError(null);
  };
  const onSubmit = handleSubmit((v) => {
    setFormError(null);
    save.mutate(
      { field, body: { value: v.value, source: sourceOf(v as { sourceKind: SourceKind; source: string }) } },
      {
        onSuccess: close,
        onError: (error) =>
          setFormError(applyServerErrors(error, setError, ['value', 'value.min', 'value.max', 'value.from', 'source'])),
      },
    );
  });
  const message = (path: string): string | undefined => {
    const parts = path.split('.');
    let at: unknown = errors;
    for (const p of parts) at = (at as Record<string, unknown> | undefined)?.[p];
    return (at as { message?: string } | undefined)?.message;
  };
  const goBack = () => {
    setClearError(null);
    clear.mutate(field, { onError: (error) => setClearError(applyServerErrors(error, () => {}, [])) });
  };

  return (
    <div className="mt-2 flex flex-wrap gap-2">
      <Button variant="secondary" className="min-h-11 px-3 text-sm" onClick={openForm} aria-label={`Use a club value: ${lower}`}>
        Use a club value
      </Button>
      {current?.overridden && (
        <Button
          variant="ghost"
          className="min-h-11 px-3 text-sm"
          onClick={goBack}
          loading={clear.isPending}
          loadingText="Going back…"
          aria-label={`Go back to the reference value: ${lower}`}
        >
          Go back to the reference value
        </Button>
      )}
      {clearError && (
        <Alert tone="error" className="w-full">
          {clearError}
        </Alert>
      )}
      <Dialog
        open={open}
        onClose={close}
        title={`Club value: ${lower}`}
        description="The club's own value replaces the reference one on this crop's page and in the club's plot books."
      >
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {formError && <Alert tone="error">{formError}</Alert>}
          {spec.kind === 'choice' ? (
            <Select label={term} error={message('value')} {...register('value')}>
              {spec.options.map((o) => (
                <option key={o} value={o}>
                  {spec.labels[o]}
                </option>
              ))}
            </Select>
          ) : (
            <>
              {message('value') && <Alert tone="error">{message('value')}</Alert>}
              <div className="grid grid-cols-2 gap-3">
                <TextField
                  label={`Least (${spec.kind === 'maturity' ? 'days' : spec.unit})`}
                  type="number"
                  step="any"
                  inputMode="decimal"
                  error={message('value.min')}
                  {...register('value.min', numberInput)}
                />
                <TextField
                  label={`Most (${spec.kind === 'maturity' ? 'days' : spec.unit})`}
                  type="number"
                  step="any"
                  inputMode="decimal"
                  error={message('value.max')}
                  {...register('value.max', numberInput)}
                />
              </div>
              {spec.kind === 'maturity' && (
                <Select label="Counted from" error={message('value.from')} {...register('value.from')}>
                  <option value="sowing">Sowing</option>
                  <option value="transplanting">Transplanting</option>
                </Select>
              )}
            </>
          )}
          <SourceFields
            what="club value"
            kind={sourceKind}
            kindProps={register('sourceKind')}
            textProps={register('source')}
            kindError={message('sourceKind')}
            textError={message('source')}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" loading={save.isPending} loadingText="Saving…">
              Save the club value
            </Button>
            <Button variant="ghost" onClick={close}>
              Cancel
            </Button>
          </div>
        </form>
      </Dialog>
    </div>
  );
}
