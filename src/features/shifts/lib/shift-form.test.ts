import { describe, expect, it } from 'vitest';
import { ShiftCreateBodySchema } from '@shared/schemas/shifts';
import { createBodyFromSuggestion, ShiftDetailsFormSchema, ShiftFormSchema, shiftFormValues } from './shift-form';

const typed = {
  siteId: '3',
  title: ' Evening watering ',
  kind: 'water' as const,
  date: '2026-07-14',
  startTime: '18:00',
  endTime: '19:30',
  capacity: '2',
  estHours: '1,5',
  instructions: 'Cans are in the shed.',
};

describe('the shift form', () => {
  it('turns the boxes into the body the server takes', () => {
    const checked = ShiftFormSchema.parse(typed);
    expect(checked).toEqual({
      siteId: 3,
      title: 'Evening watering',
      kind: 'water',
      date: '2026-07-14',
      startTime: '18:00',
      endTime: '19:30',
      capacity: 2,
      estHours: 1.5,
      instructions: 'Cans are in the shed.',
    });
    // A work day of the coordinator's own: no tasks; the shared schema takes it as it is.
    expect(ShiftCreateBodySchema.safeParse({ ...checked, taskIds: [] }).success).toBe(true);
  });

  it('puts the shared schema’s words on the boxes', () => {
    const issues = (values: Partial<typeof typed>) =>
      Object.fromEntries((ShiftFormSchema.safeParse({ ...typed, ...values }).error?.issues ?? []).map((i) => [String(i.path[0]), i.message]));
    expect(issues({ title: '  ' })).toEqual({ title: 'Give the shift a name' });
    expect(issues({ capacity: 'two' })).toEqual({ capacity: 'A whole number of people, like 2' });
    expect(issues({ capacity: '0' })).toEqual({ capacity: 'At least 1 person' });
    expect(issues({ capacity: '51' })).toEqual({ capacity: 'At most 50 people' });
    expect(issues({ estHours: '0.1' })).toEqual({ estHours: 'At least a quarter of an hour' });
    expect(issues({ startTime: '6pm' })).toEqual({ startTime: 'A time like 18:00' });
    expect(issues({ endTime: '17:00' })).toEqual({ endTime: 'The end is before the start' });
    expect(issues({ siteId: '' })).toEqual({ siteId: 'Choose a site' });
  });

  it('fills the boxes from a suggestion or a shift, and builds a body from a suggestion', () => {
    const suggestion = { siteId: 3, kind: 'weed' as const, title: 'Weeding, plots A-1 and A-2', date: '2026-07-15', startTime: '10:00', endTime: '11:00', capacity: 1, estHours: 0.75, taskIds: [11, 12] };
    const values = shiftFormValues(suggestion);
    expect(values).toMatchObject({ siteId: '3', capacity: '1', estHours: '0.75', instructions: '' });
    const details = ShiftDetailsFormSchema.parse({ ...values, capacity: '2' });
    const body = createBodyFromSuggestion(suggestion, details);
    expect(body).toMatchObject({ siteId: 3, taskIds: [11, 12], capacity: 2, estHours: 0.75, title: 'Weeding, plots A-1 and A-2' });
    expect(ShiftCreateBodySchema.safeParse(body).success).toBe(true);
  });
});
