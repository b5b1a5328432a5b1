import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { applyServerErrors } from '@/lib/forms/server-errors';
import { useCreateCropRelation } from '../api/create-crop-relation';
import { useCrops } from '../api/get-crops';
import { SourceFields, sourceOf, sourceKinds } from './source-fields';

const FormSchema = z
  .object({
    otherId: z.string().min(1, 'Choose the other crop').transform(Number),
    effect: z.enum(['beneficial', 'antagonistic']),
    scope: z.enum(['same_plot', 'neighbours']),
    distance: z.string(),
    reason: z.string().trim().min(1, 'Say why, in a sentence').max(500, 'At most 500 characters'),
    evidence: z.enum(['common_practice', 'research']),
    sourceKind: z.enum(sourceKinds),
    source: z.string(),
  })
  .superRefine((v, ctx) => {
    const d = Number(v.distance.replace(',', '.'));
    if (v.scope === 'neighbours' && !(d >= 0.1 && d <= 50)) ctx.addIssue({ code: 'custom', path: ['distance'], message: 'From 0.1 to 50 m' });
    if (v.sourceKind === 'other' && !v.source.trim()) ctx.addIssue({ code: 'custom', path: ['source'], message: 'Name the source' });
    if (v.evidence === 'research' && v.sourceKind !== 'other') ctx.addIssue({ code: 'custom', path: ['sourceKind'], message: 'Research needs the publication named' });
  });
type FormInput = z.input<typeof FormSchema>;

/**
 * A coordinator's own companion or antagonist for this crop, with its reach, reason, evidence and
 * source; in the club's view it replaces a reference relation for the same pair.
 */
export function AddClubRelation({ clubId, cropId, cropName }: { clubId: number; cropId: number; cropName: string }) {
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const crops = useCrops(clubId);
  const create = useCreateCropRelation(clubId);
  const {
    register,
    handleSubmit,
    control,
    setError,
    reset,
    formState: { errors },
  } = useForm<FormInput, unknown, z.output<typeof FormSchema>>({
    resolver: zodResolver(FormSchema),
    defaultValues: { otherId: '', effect: 'beneficial', scope: 'same_plot', distance: '1.5', reason: '', evidence: 'common_practice', sourceKind: 'common-practice', source: '' },
  });
  const scope = useWatch({ control, name: 'scope' });
  const sourceKind = useWatch({ control, name: 'sourceKind' });
  const close = () => {
    setOpen(false);
    setFormError(null);
    reset();
  };
  const onSubmit = handleSubmit((v) => {
    setFormError(null);
    create.mutate(
      {
        cropAId: cropId,
        cropBId: v.otherId,
        effect: v.effect,
        scope: v.scope === 'same_plot' ? { kind: 'same_plot' } : { kind: 'neighbours', distanceM: Number(v.distance.replace(',', '.')) },
        reason: v.reason,
        evidence: v.evidence,
        // Folk antagonisms are only ever a watch; a clash needs research behind it.
        ...(v.effect === 'antagonistic' ? { severity: v.evidence === 'research' ? ('clash' as const) : ('watch' as const) } : {}),
        source: sourceOf(v),
      },
      {
        onSuccess: close,
        onError: (error) => {
          const message = applyServerErrors(error, setError, ['reason', 'source']);
          setFormError(message);
        },
      },
    );
  });
  const others = (crops.data?.items ?? []).filter((c) => c.id !== cropId);
  return (
    <>
      <Button variant="secondary" onClick={() => setOpen(true)}>
        Add a club relation
      </Button>
      <Dialog open={open} onClose={close} title={`A club relation for ${cropName}`}>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {formError && <Alert tone="error">{formError}</Alert>}
          <Select label="With" error={errors.otherId?.message} {...register('otherId')}>
            <option value="">{crops.isPending ? 'Loading the crop notes…' : 'Choose a crop'}</option>
            {others.map((c) => (
              <option key={c.id} value={c.id}>
                {c.commonName}
              </option>
            ))}
          </Select>
          <Select label="They" {...register('effect')}>
            <option value="beneficial">Help each other (a good pairing)</option>
            <option value="antagonistic">Should be kept apart</option>
          </Select>
          <Select label="Where it matters" {...register('scope')}>
            <option value="same_plot">In the same plot</option>
            <option value="neighbours">Also across paths to neighbouring plots</option>
          </Select>
          {scope === 'neighbours' && <TextField label="Up to how far (m)" inputMode="decimal" error={errors.distance?.message} {...register('distance')} />}
          <TextAreaField label="Why" rows={3} error={errors.reason?.message} {...register('reason')} />
          <Select label="Evidence" {...register('evidence')}>
            <option value="common_practice">Common practice (gardeners' experience)</option>
            <option value="research">Research-backed (name the publication)</option>
          </Select>
          <SourceFields
            what="relation"
            kind={sourceKind}
            kindProps={register('sourceKind')}
            textProps={register('source')}
            kindError={errors.sourceKind?.message}
            textError={errors.source?.message}
          />
          <div className="flex flex-wrap gap-3">
            <Button type="submit" loading={create.isPending} loadingText="Saving…">
              Save the relation
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
