import { z } from 'zod';
import { ShiftCreateBodySchema, type ShiftCreateBody, type ShiftKind } from '@shared/schemas/shifts';

// One form for a shift's details, used to edit a shift, to change a suggestion before creating it and
// to add a work day of the coordinator's own. The boxes hold text; checking turns them into the
// shared schema's numbers, with the shared schema's limits and words.

const shape = ShiftCreateBodySchema.shape;

/** What the boxes hold. */
export interface ShiftFormValues {
  siteId: string;
  title: string;
  kind: ShiftKind;
  date: string;
  startTime: string;
  endTime: string;
  capacity: string;
  estHours: string;
  instructions: string;
}

const WHOLE = /^\d+$/;
const DECIMAL = /^\d+([.,]\d+)?$/;

const wholeText = (message: string) =>
  z
    .string()
    .trim()
    .refine((v) => WHOLE.test(v), message)
    .transform(Number);

const decimalText = (message: string) =>
  z
    .string()
    .trim()
    .refine((v) => DECIMAL.test(v), message)
    .transform((v) => Number(v.replace(',', '.')));

const fields = {
  siteId: wholeText('Choose a site').pipe(shape.siteId),
  title: shape.title,
  kind: shape.kind,
  date: shape.date,
  startTime: z.string().trim().pipe(shape.startTime),
  endTime: z.string().trim().pipe(shape.endTime),
  capacity: wholeText('A whole number of people, like 2').pipe(shape.capacity),
  estHours: decimalText('Hours, like 1.5').pipe(shape.estHours),
  instructions: shape.instructions,
};

const endAfterStart = { message: 'The end is before the start', path: ['endTime'] };
const TIME = /^([01]\d|2[0-3]):[0-5]\d$/;
/** Compared only when both are times, so a mistyped start is not also called "before the start". */
const endsAfterStart = (v: { startTime: string; endTime: string }) => !TIME.test(v.startTime) || !TIME.test(v.endTime) || v.endTime > v.startTime;

/** The whole form checked (a new shift): the site and every detail. */
export const ShiftFormSchema = z.object(fields).refine(endsAfterStart, endAfterStart);

/** The form without the site (editing a shift, or a suggestion whose site is set): the site's box is read past. */
export const ShiftDetailsFormSchema = z
  .object({ ...fields, siteId: z.string() })
  .refine(endsAfterStart, endAfterStart)
  .transform(({ siteId: _siteId, ...details }) => details);

export type ShiftDetailsChecked = z.output<typeof ShiftDetailsFormSchema>;

/** The boxes filled from a shift or a suggestion, numbers written as they are typed. */
export function shiftFormValues(s: {
  siteId?: number;
  title: string;
  kind: ShiftKind;
  date: string;
  startTime: string;
  endTime: string;
  capacity: number;
  estHours: number;
  instructions?: string;
}): ShiftFormValues {
  return {
    siteId: s.siteId === undefined ? '' : String(s.siteId),
    title: s.title,
    kind: s.kind,
    date: s.date,
    startTime: s.startTime,
    endTime: s.endTime,
    capacity: String(s.capacity),
    estHours: String(s.estHours),
    instructions: s.instructions ?? '',
  };
}

/** The field names the server may name in a 400, for putting its messages on the boxes. */
export const shiftFormFieldNames = ['siteId', 'title', 'kind', 'date', 'startTime', 'endTime', 'capacity', 'estHours', 'instructions'] as const;

/** A new shift's body from a suggestion and the details as checked: the suggestion's site and tasks, the form's words and times. */
export function createBodyFromSuggestion(s: { siteId: number; taskIds: number[] }, details: ShiftDetailsChecked): ShiftCreateBody {
  return { siteId: s.siteId, taskIds: s.taskIds, ...details };
}
