import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import type { ShiftFormValues } from '../lib/shift-form';
import { kindOrder, kindWords } from '../lib/words';

export interface ShiftFieldsProps {
  register: UseFormRegister<ShiftFormValues>;
  errors: FieldErrors<ShiftFormValues>;
  /** Which boxes to show; the others keep their values unseen. */
  show: { site?: Array<{ id: number; name: string }>; kind?: boolean; date?: boolean };
}

/** A shift's details as boxes: name, (site, kind, date,) start and end, places, hours and instructions. */
export function ShiftFields({ register, errors, show }: ShiftFieldsProps) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField label="Name of the shift" className="sm:col-span-2" maxLength={160} error={errors.title?.message} {...register('title')} />
      {show.site && (
        <Select label="Site" error={errors.siteId?.message} {...register('siteId')}>
          <option value="">Choose a site</option>
          {show.site.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </Select>
      )}
      {show.kind && (
        <Select label="Kind of work" error={errors.kind?.message} {...register('kind')}>
          {kindOrder.map((k) => (
            <option key={k} value={k}>
              {kindWords[k]}
            </option>
          ))}
        </Select>
      )}
      {show.date && <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />}
      <TextField label="Starts at" hint="On the site's clock." type="time" error={errors.startTime?.message} {...register('startTime')} />
      <TextField label="Ends at" hint="On the site's clock." type="time" error={errors.endTime?.message} {...register('endTime')} />
      <TextField label="Places" hint="How many people, 1 to 50." inputMode="numeric" error={errors.capacity?.message} {...register('capacity')} />
      <TextField label="Hours it takes one person" hint="Counted for each volunteer who marks it done, e.g. 1.5." inputMode="decimal" error={errors.estHours?.message} {...register('estHours')} />
      <TextAreaField
        label="Instructions (optional)"
        hint="Where the tools and water are, what to look out for."
        className="sm:col-span-2"
        rows={3}
        maxLength={2000}
        error={errors.instructions?.message}
        {...register('instructions')}
      />
    </div>
  );
}
