import { z } from 'zod';
import { minorToDecimal } from '@shared/fees/money';
import { FeeScheduleSchema, type FeeSchedule } from '@shared/schemas/fees';
import { moneyText } from './money-form';

/** What the schedule inputs hold: money as decimal text in the club currency, the percent as text. */
export interface ScheduleFormValues {
  basis: FeeSchedule['basis'];
  areaUnit: FeeSchedule['areaUnit'];
  rateMinorPerArea: string;
  priceInGroundMinor: string;
  priceRaisedBedMinor: string;
  priceContainerMinor: string;
  priceSharedBedMinor: string;
  concessionPercent: string;
  depositMinor: string;
}

export const moneyFields = [
  'rateMinorPerArea',
  'priceInGroundMinor',
  'priceRaisedBedMinor',
  'priceContainerMinor',
  'priceSharedBedMinor',
  'depositMinor',
] as const;

// The inputs carry the API's own names so the server's field errors land on them unchanged.
export const scheduleFieldNames = ['basis', 'areaUnit', ...moneyFields, 'concessionPercent'] as const satisfies readonly (keyof ScheduleFormValues)[];

const shape = FeeScheduleSchema.shape;

/** Reads the inputs into a fee schedule body, checked by the same schema the server uses. */
export const ScheduleFormSchema = z.object({
  basis: shape.basis,
  areaUnit: shape.areaUnit,
  rateMinorPerArea: moneyText.pipe(shape.rateMinorPerArea),
  priceInGroundMinor: moneyText.pipe(shape.priceInGroundMinor),
  priceRaisedBedMinor: moneyText.pipe(shape.priceRaisedBedMinor),
  priceContainerMinor: moneyText.pipe(shape.priceContainerMinor),
  priceSharedBedMinor: moneyText.pipe(shape.priceSharedBedMinor),
  concessionPercent: z
    .string()
    .trim()
    .regex(/^\d+$/, 'A whole number from 0 to 100')
    .transform(Number)
    .pipe(shape.concessionPercent),
  depositMinor: moneyText.pipe(shape.depositMinor),
});

/** A saved schedule as the inputs show it: "45.00", not 4500. */
export function scheduleToForm(s: FeeSchedule): ScheduleFormValues {
  return {
    basis: s.basis,
    areaUnit: s.areaUnit,
    rateMinorPerArea: minorToDecimal(s.rateMinorPerArea),
    priceInGroundMinor: minorToDecimal(s.priceInGroundMinor),
    priceRaisedBedMinor: minorToDecimal(s.priceRaisedBedMinor),
    priceContainerMinor: minorToDecimal(s.priceContainerMinor),
    priceSharedBedMinor: minorToDecimal(s.priceSharedBedMinor),
    concessionPercent: String(s.concessionPercent),
    depositMinor: minorToDecimal(s.depositMinor),
  };
}
