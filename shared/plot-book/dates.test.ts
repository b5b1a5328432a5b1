import { afterEach, describe, expect, it } from 'vitest';
import type { Germination, Sourced } from '../crops/types';
import { fahrenheitToCelsius as f } from './emergence';
import { daysBetween, nextOccurrence, plantingDates, plusDays, THINNING_DAYS_AFTER_EMERGENCE, TRANSPLANT_AGE_DAYS, type PlantingInput } from './dates';

// Test fixtures, not crop data: values from sources.md (section 7: OSU Extension / Harrington &
// Minges via Knott's Handbook; section 8: Encyclopaedia Britannica days to maturity, * = from
// transplanting; section 10: common practice). Frost tolerance is from memory (fixture only).
type FixtureCrop = PlantingInput['crop'];

function germ(minF: number, maxF: number): Sourced<Germination> {
  return { value: { minC: f(minF), optimumC: { min: f(minF), max: f(maxF) }, maxC: f(maxF) }, source: 'osu-soil-temperature' };
}

const radish: FixtureCrop = {
  germination: germ(40, 95),
  daysToEmergence: { value: { min: 5, max: 10 }, source: 'common_practice' },
  emergenceByTemperature: { value: [11, 6, 4, 4, 3], source: 'harrington-minges-knott' },
  daysToMaturity: { value: { min: 25, max: 50, from: 'sowing' }, source: 'britannica' },
  sideDressing: { value: { needed: false }, source: 'common_practice' },
  frost: { value: 'hardy', source: 'from_memory' },
};

const tomato: FixtureCrop = {
  germination: germ(50, 95),
  daysToEmergence: { value: { min: 6, max: 14 }, source: 'from_memory' },
  emergenceByTemperature: { value: [43, 14, 8, 6, 6], source: 'harrington-minges-knott' },
  daysToMaturity: { value: { min: 70, max: 90, from: 'transplanting' }, source: 'britannica' },
  // "a few weeks after emergence" (common practice), taken as 3–4 weeks for the fixture
  sideDressing: { value: { needed: true, weeksAfterEmergence: { min: 3, max: 4 } }, source: 'common_practice' },
  frost: { value: 'tender', source: 'from_memory' },
};

const bean: FixtureCrop = {
  germination: germ(60, 95),
  daysToEmergence: { value: { min: 7, max: 14 }, source: 'from_memory' },
  emergenceByTemperature: { value: [null, 16, 11, 8, 6], source: 'harrington-minges-knott' },
  daysToMaturity: { value: { min: 50, max: 60, from: 'sowing' }, source: 'britannica' },
  sideDressing: { value: { needed: false }, source: 'common_practice' },
  frost: { value: 'tender', source: 'from_memory' },
};

describe('calendar arithmetic', () => {
  const savedTz = process.env.TZ;
  afterEach(() => {
    process.env.TZ = savedTz;
  });

  it('crosses month ends and leap days by the calendar', () => {
    // calendar: February 2027 has 28 days, February 2028 has 29
    expect(plusDays('2027-01-31', 30)).toBe('2027-03-02');
    expect(plusDays('2027-01-31', 1)).toBe('2027-02-01');
    expect(plusDays('2027-02-28', 1)).toBe('2027-03-01');
    expect(plusDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(plusDays('2028-02-29', 1)).toBe('2028-03-01');
    expect(plusDays('2028-03-01', -1)).toBe('2028-02-29');
    expect(plusDays('2027-12-31', 1)).toBe('2028-01-01');
    expect(daysBetween('2028-02-01', '2028-03-01')).toBe(29);
    expect(daysBetween('2027-02-01', '2027-03-01')).toBe(28);
  });

  it('does not move a day across the DST changes in London and New York, whatever the machine zone', () => {
    // IANA tz database (from memory): London changes on 28 March and 31 October 2027,
    // New York on 14 March and 7 November 2027.
    process.env.TZ = 'Europe/London';
    expect(new Date(2027, 5, 1).getTimezoneOffset()).toBe(-60); // the zone really is in force
    expect(plusDays('2027-03-27', 1)).toBe('2027-03-28');
    expect(plusDays('2027-03-27', 2)).toBe('2027-03-29');
    expect(plusDays('2027-10-30', 2)).toBe('2027-11-01');
    expect(daysBetween('2027-03-27', '2027-03-29')).toBe(2);
    expect(plantingDates({ crop: radish, method: 'sown', date: '2027-03-27' }).emergence?.expected).toBe('2027-04-04');

    process.env.TZ = 'America/New_York';
    expect(new Date(2027, 5, 1).getTimezoneOffset()).toBe(240);
    expect(plusDays('2027-03-13', 1)).toBe('2027-03-14');
    expect(plusDays('2027-03-13', 2)).toBe('2027-03-15');
    expect(plusDays('2027-11-06', 2)).toBe('2027-11-08');
    expect(daysBetween('2027-11-06', '2027-11-08')).toBe(2);
    expect(plantingDates({ crop: radish, method: 'sown', date: '2027-11-03' }).emergence?.expected).toBe('2027-11-11');
  });

  it('refuses what is not a calendar date', () => {
    expect(() => plusDays('2027-02-29', 1)).toThrow(RangeError);
    expect(() => plusDays('27/03/2027', 1)).toThrow(RangeError);
    expect(() => plusDays('2027-03-27', 1.5)).toThrow(RangeError);
    expect(() => plantingDates({ crop: radish, method: 'sown', date: '2027-13-01' })).toThrow(RangeError);
  });

  it('finds the next frost date by month and day', () => {
    expect(nextOccurrence('2020-10-15', '2027-06-01')).toBe('2027-10-15');
    expect(nextOccurrence('2020-10-15', '2027-10-15')).toBe('2027-10-15');
    expect(nextOccurrence('2020-10-15', '2027-10-16')).toBe('2028-10-15');
    // 29 February in a year without one is 28 February
    expect(nextOccurrence('2028-02-29', '2027-01-01')).toBe('2027-02-28');
    expect(nextOccurrence('2028-02-29', '2028-01-01')).toBe('2028-02-29');
  });
});

describe('plantingDates for a sown crop', () => {
  it('gives radish sown into 60 °F soil its emergence, thinning and harvest window', () => {
    // 60 °F: 5.78 days → 6 (Harrington & Minges, computed); thinning a week later (common practice,
    // section 10: "soon after emergence"); 25–50 days from sowing (Britannica).
    const d = plantingDates({ crop: radish, method: 'sown', date: '2027-04-10', soilC: f(60), lastSpringFrost: '2027-05-01', firstAutumnFrost: '2027-10-10' });
    expect(d.emergence).toMatchObject({ expected: '2027-04-16', earliest: '2027-04-15', latest: '2027-04-16' });
    expect(d.thinning).toBe('2027-04-23');
    expect(THINNING_DAYS_AFTER_EMERGENCE).toBe(7);
    expect(d.sideDressing).toBeNull();
    expect(d.harvest).toEqual({ earliest: '2027-05-05', latest: '2027-05-30', countedFrom: 'sowing', allowanceDays: 0 });
    // hardy: no frost warnings even when sown before the last frost
    expect(d.warnings).toEqual([]);
  });

  it('uses the crop’s range without a soil temperature', () => {
    // 5–10 days (common practice), midpoint 7.5 → 8
    const d = plantingDates({ crop: radish, method: 'sown', date: '2027-04-10' });
    expect(d.emergence).toMatchObject({ expected: '2027-04-18', earliest: '2027-04-15', latest: '2027-04-20' });
    expect(d.thinning).toBe('2027-04-25');
  });

  it('adds the transplant allowance when a crop counted from transplanting is sown direct', () => {
    // tomato 70–90 days from transplanting (Britannica) + 42 days allowance (common practice, from
    // memory) = 112–132 days from 20 May 2027: 9 Sep and 29 Sep (computed). 20 °C soil: 8 days
    // (Harrington & Minges) → 28 May; side-dressing 3–4 weeks after that: 18 and 25 June.
    const d = plantingDates({ crop: tomato, method: 'sown', date: '2027-05-20', soilC: 20 });
    expect(TRANSPLANT_AGE_DAYS).toBe(42);
    expect(d.harvest).toEqual({ earliest: '2027-09-09', latest: '2027-09-29', countedFrom: 'transplanting', allowanceDays: 42 });
    expect(d.emergence?.expected).toBe('2027-05-28');
    expect(d.sideDressing).toEqual({ earliest: '2027-06-18', latest: '2027-06-25' });
  });

  it('gives no emergence, thinning or feeding date when the soil is too cold, but still the harvest window', () => {
    // snap bean minimum 60 °F (OSU Extension); 12 °C is below it. 50–60 days (Britannica).
    const d = plantingDates({ crop: bean, method: 'sown', date: '2027-05-01', soilC: 12 });
    expect(d.emergence).toBeNull();
    expect(d.thinning).toBeNull();
    expect(d.warnings.map((w) => w.kind)).toEqual(['soil_too_cold']);
    expect(d.harvest).toMatchObject({ earliest: '2027-06-20', latest: '2027-06-30' });
  });
});

describe('plantingDates for a transplant', () => {
  it('counts tomato’s harvest and side-dressing from transplanting', () => {
    // 70–90 days from transplanting (Britannica): 20 May + 70 = 29 Jul, + 90 = 18 Aug (computed)
    const d = plantingDates({ crop: tomato, method: 'transplanted', date: '2027-05-20' });
    expect(d.emergence).toBeNull();
    expect(d.thinning).toBeNull();
    expect(d.sideDressing).toEqual({ earliest: '2027-06-10', latest: '2027-06-17' });
    expect(d.harvest).toEqual({ earliest: '2027-07-29', latest: '2027-08-18', countedFrom: 'transplanting', allowanceDays: 0 });
  });

  it('takes the allowance off when a crop counted from sowing is transplanted', () => {
    // bean 50–60 days from sowing (Britannica) − 42 = 8–18 days after transplanting (computed)
    const d = plantingDates({ crop: bean, method: 'transplanted', date: '2027-06-01' });
    expect(d.harvest).toEqual({ earliest: '2027-06-09', latest: '2027-06-19', countedFrom: 'sowing', allowanceDays: -42 });
  });
});

describe('frost warnings for tender crops', () => {
  // Illustrative site frost dates (not a published figure): last spring frost 15 May, first autumn frost 15 Oct.
  const north = { lastSpringFrost: '2027-05-15', firstAutumnFrost: '2027-10-15' };
  const kinds = (date: string, crop: FixtureCrop = tomato, frost: Partial<typeof north> = north) =>
    plantingDates({ crop, method: 'transplanted', date, ...frost }).warnings.map((w) => w.kind);

  it('warns on or before the last spring frost, not the day after', () => {
    expect(kinds('2027-05-01')).toEqual(['before_last_frost']);
    expect(kinds('2027-05-15')).toEqual(['before_last_frost']);
    expect(kinds('2027-05-16')).toEqual([]);
    // after the autumn frost, in winter, it is again before the (next) spring frost
    expect(kinds('2027-12-01')).toContain('before_last_frost');
    const w = plantingDates({ crop: tomato, method: 'sown', date: '2027-05-10', ...north }).warnings[0];
    expect(w).toMatchObject({ kind: 'before_last_frost', lastFrost: '2027-05-15' });
    expect(w.message).toMatch(/^Sown/);
  });

  it('warns without an autumn date up to half a year before the spring frost', () => {
    expect(kinds('2027-03-01', tomato, { lastSpringFrost: '2027-05-15' })).toEqual(['before_last_frost']);
    expect(kinds('2027-05-16', tomato, { lastSpringFrost: '2027-05-15' })).toEqual([]);
  });

  it('says a planting will not mature when its earliest harvest is on or after the first frost', () => {
    // 70 days from transplanting (Britannica). 6 Aug + 70 = 15 Oct, the frost day itself (computed).
    expect(kinds('2027-08-06')).toEqual(['will_not_mature']);
    const w = plantingDates({ crop: tomato, method: 'transplanted', date: '2027-08-06', ...north }).warnings[0];
    expect(w).toMatchObject({ kind: 'will_not_mature', message: 'This planting will not mature before the first frost.', firstFrost: '2027-10-15' });
    // 5 Aug + 70 = 14 Oct: it matures, but 5 Aug + 90 = 3 Nov is past the frost
    expect(kinds('2027-08-05')).toEqual(['harvest_cut_by_frost']);
  });

  it('warns that frost ends the harvest only when the latest harvest reaches the frost day', () => {
    // 16 Jul + 90 = 14 Oct (computed): the whole window is before the frost
    expect(kinds('2027-07-16')).toEqual([]);
    // 17 Jul + 90 = 15 Oct
    expect(kinds('2027-07-17')).toEqual(['harvest_cut_by_frost']);
  });

  it('leaves hardy crops alone', () => {
    expect(plantingDates({ crop: radish, method: 'sown', date: '2027-09-20', ...north }).warnings).toEqual([]);
    expect(plantingDates({ crop: radish, method: 'sown', date: '2027-02-01', ...north }).warnings).toEqual([]);
  });

  it('works for a southern-hemisphere site with spring frost in October and autumn frost in April', () => {
    // Illustrative southern site: last spring frost 1 Oct, first autumn frost 20 Apr.
    const south = { lastSpringFrost: '2027-10-01', firstAutumnFrost: '2027-04-20' };
    // 1 Nov 2027 + 70–90 = 10–30 Jan 2028, long before the April frost
    expect(kinds('2027-11-01', tomato, south)).toEqual([]);
    expect(kinds('2027-09-15', tomato, south)).toEqual(['before_last_frost']);
    expect(kinds('2027-07-01', tomato, south)).toContain('before_last_frost');
    // 15 Feb 2028 + 70 = 25 Apr 2028 (2028 is a leap year), after the 20 Apr frost (computed)
    expect(kinds('2028-02-15', tomato, south)).toEqual(['will_not_mature']);
    // 1 Feb 2028 + 70 = 11 Apr, + 90 = 1 May: matures, then frost ends it
    expect(kinds('2028-02-01', tomato, south)).toEqual(['harvest_cut_by_frost']);
    const w = plantingDates({ crop: tomato, method: 'transplanted', date: '2028-02-15', ...south }).warnings[0];
    expect(w).toMatchObject({ firstFrost: '2028-04-20' });
  });
});
