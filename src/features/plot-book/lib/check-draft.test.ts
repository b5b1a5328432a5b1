import { describe, expect, it } from 'vitest';
import { draftFromForm, type PlantingFormValues } from './check-draft';

const filled: PlantingFormValues = { cropId: '12', method: 'sown', plantedOn: '2027-04-12', layout: 'rows', rowCount: '', quantity: '', status: 'planned' };

describe('draftFromForm', () => {
  it('waits for a crop and a date', () => {
    expect(draftFromForm({ ...filled, cropId: '' }, null)).toBeNull();
    expect(draftFromForm({ ...filled, plantedOn: '' }, null)).toBeNull();
    expect(draftFromForm({ ...filled, plantedOn: '2027-4-1' }, null)).toBeNull();
  });
  it('sends the filled form with the part and no planting id', () => {
    const part = { x: 0, y: 0.5, width: 1, length: 2 };
    expect(draftFromForm({ ...filled, rowCount: '3', quantity: ' 40 ' }, part)).toEqual({
      cropId: 12,
      method: 'sown',
      plantedOn: '2027-04-12',
      part,
      layout: 'rows',
      rowCount: 3,
      quantity: 40,
      status: 'planned',
      plantingId: null,
    });
  });
  it('leaves out counts that are not whole numbers in range yet', () => {
    const d = draftFromForm({ ...filled, rowCount: '2.5', quantity: '0' }, null);
    expect(d?.rowCount).toBeNull();
    expect(d?.quantity).toBeNull();
    expect(draftFromForm({ ...filled, rowCount: '1001' }, null)?.rowCount).toBeNull();
  });
});
