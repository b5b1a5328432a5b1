import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Plus } from 'lucide-react';
import { CropCreateBodySchema, cropKinds, cropValueSchemas, sowingMethods, type CropCreateBody } from '@shared/schemas/crops';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { paths } from '@/lib/paths';
import { useCreateCrop } from '../api/create-crop';
import { kindLabels, sowingLabels } from '../lib/format';
import { SourceFields, sourceOf, sourcedFormSchema, type SourceKind } from './source-fields';

// The required fields of a club crop, each value of the trade with its source select; the crop's
// page is where the rest would be added later.
const AddCropFormSchema = z.object({
  commonName: CropCreateBodySchema.shape.commonName,
  kind: CropCreateBodySchema.shape.kind,
  botanicalName: sourcedFormSchema(cropValueSchemas.botanicalName),
  family: sourcedFormSchema(cropValueSchemas.family),
  sowing: sourcedFormSchema(cropValueSchemas.sowing),
  daysToMaturity: sourcedFormSchema(cropValueSchemas.daysToMaturity),
});
type AddCropFormIn = z.input<typeof AddCropFormSchema>;
type AddCropForm = z.output<typeof AddCropFormSchema>;

const sourced = <T,>(v: { value: T; sourceKind: SourceKind; source: string }) => ({ value: v.value, source: sourceOf(v) });

const toBody = (f: AddCropForm): CropCreateBody => ({
  commonName: f.commonName,
  kind: f.kind,
  botanicalName: sourced(f.botanicalName),
  family: sourced(f.family),
  sowing: sourced(f.sowing),
  daysToMaturity: sourced(f.daysToMaturity),
});

const blankSource = { sourceKind: 'common-practice' as SourceKind, source: '' };
const blank: AddCropFormIn = {
  commonName: '',
  kind: 'leaf',
  botanicalName: { value: '', ...blankSource },
  family: { value: '', ...blankSource },
  sowing: { value: 'direct', ...blankSource },
  daysToMaturity: { value: { min: Number.NaN, max: Number.NaN, from: 'sowing' }, ...blankSource },
};

const FIELD_NAMES = [
  'commonName',
  'kind',
  'botanicalName.value',
  'botanicalName.source',
  'family.value',
  'family.source',
  'sowing.value',
  'sowing.source',
  'daysToMaturity.value',
  'daysToMaturity.value.min',
  'daysToMaturity.value.max',
  'daysToMaturity.value.from',
  'daysToMaturity.source',
] as const;

/** "Add a club crop" on the crop notes (coordinators; the server decides): the new crop's page opens after saving. */
export function AddClubCrop({ clubId }: { clubId: number }) {
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const create = useCreateCrop(clubId);
  const navigate = useNavigate();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors },
  } = useForm<AddCropFormIn, unknown, AddCropForm>({ resolver: zodResolver(AddCropFormSchema), defaultValues: blank });
  const close = () => {
    setOpen(false);
    setFormError(null);
  };
  const onSubmit = handleSubmit((form) => {
    setFormError(null);
    create.mutate(toBody(form), {
      onSuccess: (crop) => {
        close();
        reset(blank);
        navigate(paths.crop(clubId, crop.id));
      },
      onError: (error) => setFormError(applyServerErrors(error, setError, FIELD_NAMES)),
    });
  });
  const kinds = useWatch({ control, name: ['botanicalName.sourceKind', 'family.sourceKind', 'sowing.sourceKind', 'daysToMaturity.sourceKind'] });
  const kindOf = { botanicalName: kinds[0], family: kinds[1], sowing: kinds[2], daysToMaturity: kinds[3] };
  const source = (name: 'botanicalName' | 'family' | 'sowing' | 'daysToMaturity', what: string) => (
    <SourceFields
      what={what}
      kind={kindOf[name]}
      kindProps={register(`${name}.sourceKind`)}
      textProps={register(`${name}.source`)}
      kindError={errors[name]?.sourceKind?.message}
      textError={errors[name]?.source?.message}
    />
  );
  const dtm = errors.daysToMaturity?.value;

  return (
    <>
      <Button onClick={() => setOpen(true)}>
        <Plus className="size-5" aria-hidden="true" />
        Add a club crop
      </Button>
      <Dialog
        open={open}
        onClose={close}
        title="Add a club crop"
        description="A crop the reference notes lack, with the club's own values and where each comes from."
      >
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {formError && <Alert tone="error">{formError}</Alert>}
          <TextField label="Common name" autoComplete="off" error={errors.commonName?.message} {...register('commonName')} />
          <TextField label="Botanical name" autoComplete="off" error={errors.botanicalName?.value?.message} {...register('botanicalName.value')} />
          {source('botanicalName', 'botanical name')}
          <TextField
            label="Botanical family"
            hint="Ending in -aceae, such as Fabaceae."
            autoComplete="off"
            error={errors.family?.value?.message}
            {...register('family.value')}
          />
          {source('family', 'family')}
          <Select label="Kind" error={errors.kind?.message} {...register('kind')}>
            {cropKinds.map((k) => (
              <option key={k} value={k}>
                {kindLabels[k]}
              </option>
            ))}
          </Select>
          <Select label="How it is sown" error={errors.sowing?.value?.message} {...register('sowing.value')}>
            {sowingMethods.map((m) => (
              <option key={m} value={m}>
                {sowingLabels[m]}
              </option>
            ))}
          </Select>
          {source('sowing', 'sowing')}
          <fieldset className="flex flex-col gap-3">
            <legend className="mb-1 font-medium">Days to maturity</legend>
            {dtm?.message && <p className="text-sm font-medium text-clay-700">{dtm.message}</p>}
            <div className="grid grid-cols-2 gap-3">
              <TextField
                label="Least (days)"
                type="number"
                inputMode="numeric"
                error={dtm?.min?.message}
                {...register('daysToMaturity.value.min', { valueAsNumber: true })}
              />
              <TextField
                label="Most (days)"
                type="number"
                inputMode="numeric"
                error={dtm?.max?.message}
                {...register('daysToMaturity.value.max', { valueAsNumber: true })}
              />
            </div>
            <Select label="Counted from" error={dtm?.from?.message} {...register('daysToMaturity.value.from')}>
              <option value="sowing">Sowing</option>
              <option value="transplanting">Transplanting</option>
            </Select>
            {source('daysToMaturity', 'days to maturity')}
          </fieldset>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" loading={create.isPending} loadingText="Saving…">
              Save the club crop
            </Button>
            <Button variant="ghost" onClick={close}>
              Cancel
            </Button>
          </div>
        </form>
      </Dialog>
    </>
  );
}
