import { describe, expect, it } from 'vitest';
import { DoneFormSchema, doneFormDefaults, doneRequestBody, MAX_PHOTO_BYTES, photoProblem } from './done-form';

describe('the “done” form', () => {
  it('takes JPEG, PNG and WebP photos up to 8 MB, and says why it refuses others', () => {
    expect(MAX_PHOTO_BYTES).toBe(8 * 1024 * 1024);
    expect(photoProblem(null)).toBeNull();
    expect(photoProblem({ type: 'image/jpeg', size: 2_000_000 })).toBeNull();
    expect(photoProblem({ type: 'image/webp', size: MAX_PHOTO_BYTES })).toBeNull();
    expect(photoProblem({ type: 'image/png', size: MAX_PHOTO_BYTES + 1 })).toBe('The photo is larger than 8 MB');
    expect(photoProblem({ type: 'image/heic', size: 1000 })).toBe('Use a JPEG, PNG or WebP photo');
  });

  it('reads the hours box: empty keeps the estimate, a comma is a decimal point, the server’s limits apply', () => {
    const parse = (hours: string) => DoneFormSchema.safeParse({ note: ' Watered all ', hours });
    expect(parse('').data).toEqual({ note: 'Watered all', hours: null });
    expect(parse('1,5').data?.hours).toBe(1.5);
    expect(parse(' 2 ').data?.hours).toBe(2);
    expect(parse('lots').error?.issues[0].message).toBe('Enter hours like 1.5, or leave it empty');
    // The shared schema's limits: at least a quarter of an hour, at most 12.
    expect(parse('0.1').error?.issues[0].message).toBe('At least a quarter of an hour');
    expect(parse('13').error?.issues[0].message).toBe('At most 12 hours');
  });

  it('starts with the shift’s estimate in the hours box', () => {
    expect(doneFormDefaults(1.5)).toEqual({ note: '', hours: '1.5' });
  });

  it('sends JSON without a photo and multipart with one, with the link’s token when given', () => {
    expect(doneRequestBody({ note: 'All done', hours: null }, null)).toEqual({ note: 'All done', hours: null });
    expect(doneRequestBody({ note: '', hours: 2 }, null, { token: 'abc' })).toEqual({ token: 'abc', note: '', hours: 2 });

    const photo = new File([new Uint8Array([1, 2, 3])], 'beds.jpg', { type: 'image/jpeg' });
    const form = doneRequestBody({ note: 'Beds weeded', hours: 1.25 }, photo, { token: 'abc' });
    expect(form).toBeInstanceOf(FormData);
    const f = form as FormData;
    expect(f.get('token')).toBe('abc');
    expect(f.get('note')).toBe('Beds weeded');
    expect(f.get('hours')).toBe('1.25');
    expect((f.get('photo') as File).name).toBe('beds.jpg');

    const noHours = doneRequestBody({ note: '', hours: null }, photo) as FormData;
    expect(noHours.has('hours')).toBe(false);
  });
});
