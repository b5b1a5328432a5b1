import { describe, expect, it } from 'vitest';
import { cropBySlug } from '../crops';
import type { Crop } from '../crops/types';
import { plantingDates } from './dates';
import { computePlanting, type PlantingShape } from './summary';

const radish = cropBySlug('radish')!;
const tomato = cropBySlug('tomato')!;
const noClimate = { lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };
const shape = (more: Partial<PlantingShape> = {}): PlantingShape => ({
  width: 0.3, length: 3.048, layout: 'rows', rowCount: 1, quantity: null, method: 'sown', plantedOn: '2027-04-10', ...more,
});

describe('computePlanting', () => {
  it('counts a 10 ft radish row at 2 in as 60 plants', () => {
    // Radish thinned to 2 in (the crop notes, common practice); 1 ft = 0.3048 m, 1 in = 2.54 cm (NIST Handbook 44 App. C).
    expect(radish.inRowCm.value.max).toBeCloseTo(2 * 2.54, 10);
    // computed: 120 in / 2 in = 60
    expect(computePlanting(radish, shape(), noClimate).plantsThatFit).toMatchObject({ plants: 60, rows: 1, perRow: 60 });
    // computed: three rows of 60
    expect(computePlanting(radish, shape({ rowCount: 3 }), noClimate).plantsThatFit!.plants).toBe(180);
  });

  it('fills a bed with rows at the wider between-row spacing when no row count is given', () => {
    const fit = computePlanting(radish, shape({ width: 3, length: 6, rowCount: null }), noClimate).plantsThatFit!;
    // computed: rows across 3 m at 45 cm → floor(300 / 45) = 6; along 6 m at 5.08 cm → floor(600 / 5.08) = 118
    expect(radish.betweenRowCm.value.max).toBe(45);
    expect(fit).toMatchObject({ rows: 6, perRow: 118, plants: 708 });
  });

  it('uses the square grid at the equal spacing for an intensive bed', () => {
    const fit = computePlanting(radish, shape({ width: 1, length: 1, layout: 'intensive', rowCount: null }), noClimate).plantsThatFit!;
    const s = radish.equalSpacingCm.value.max;
    // computed: floor(100 / s) each way
    expect(fit.plants).toBe(Math.floor(100 / s) ** 2);
    expect(fit.inRowCm).toBe(s);
  });

  it('warns when no row fits the part, or more plants are planned than fit', () => {
    const narrow = computePlanting(radish, shape({ rowCount: null }), noClimate);
    // computed: 30 cm across at 45 cm between rows → no row
    expect(narrow.plantsThatFit!.plants).toBe(0);
    expect(narrow.warnings.map((w) => w.kind)).toEqual(['no_room']);
    const crowded = computePlanting(radish, shape({ quantity: 61 }), noClimate);
    expect(crowded.warnings.map((w) => w.kind)).toEqual(['crowded']);
    expect(computePlanting(radish, shape({ quantity: 60 }), noClimate).warnings).toEqual([]);
  });

  it('takes the soil temperature of the planting’s month and the site’s frost dates for the dates', () => {
    // Test inputs, not facts of the trade: a table with 15 °C in April, frosts on 25 April and 15 October.
    const climate = { lastSpringFrost: '04-25', firstAutumnFrost: '10-15', soilTempsC: [2, 3, 8, 15, 18, 20, 22, 21, 18, 12, 7, 3] };
    const out = computePlanting(tomato, shape({ method: 'transplanted', plantedOn: '2027-04-20', rowCount: null, width: 3, length: 6 }), climate);
    const dates = plantingDates({ crop: tomato, method: 'transplanted', date: '2027-04-20', soilC: 15, lastSpringFrost: '2027-04-25', firstAutumnFrost: '2027-10-15' });
    expect(out.soilTempC).toBe(15);
    expect(out.harvestWindow).toEqual(dates.harvest);
    expect(out.warnings.map((w) => w.kind)).toEqual(dates.warnings.map((w) => w.kind));
    expect(out.warnings.map((w) => w.kind)).toContain('before_last_frost');
    // computed: the whole 3 m × 6 m plot
    expect(out.areaM2).toBe(18);
  });

  it('still answers for a crop whose notes lack what the dates and spacing need', () => {
    const bare = { ...radish, daysToMaturity: undefined, inRowCm: undefined } as unknown as Crop;
    const out = computePlanting(bare, shape(), noClimate);
    expect(out.plantsThatFit).toBeNull();
    expect(out.harvestWindow).toBeNull();
    expect(out.warnings.map((w) => w.kind)).toEqual(['crop_notes_incomplete']);
  });
});
