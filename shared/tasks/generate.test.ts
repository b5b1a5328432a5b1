import { describe, expect, it } from 'vitest';
import { cropBySlug } from '../crops';
import { plantingDates, plusDays } from '../plot-book/dates';
import type { WeatherDay } from '../water';
import { tasksForPlanting, waterWeek, weekStartOf, WATER_MIN_DEFICIT_MM, WEEDING_WEEKS_AFTER_EMERGENCE, type TaskContext, type TaskPlantingInput } from './generate';

const radish = cropBySlug('radish')!;
const lettuce = cropBySlug('lettuce')!;

function planting(crop: typeof radish, over: Partial<TaskPlantingInput> = {}): TaskPlantingInput {
  const method = over.method ?? 'sown';
  const plantedOn = over.plantedOn ?? '2026-04-11';
  return {
    id: 1,
    cropName: crop.commonName,
    crop,
    method,
    plantedOn,
    status: 'sown',
    dates: plantingDates({ crop, method, date: plantedOn }),
    areaM2: 3,
    plotLabel: 'A-1',
    plotKind: 'in_ground',
    ...over,
  };
}

const ctx = (today: string, weather: WeatherDay[] = [], units: 'metric' | 'us' = 'metric'): TaskContext => ({
  site: { latitude: 53.4, elevationM: 60, units },
  weather: new Map(weather.map((d) => [d.date, d])),
  factors: { raisedBed: 1.2, container: 1.5 },
  today,
});

const rainOnly = (date: string, rainMm: number): WeatherDay => ({ date, tMinC: null, tMaxC: null, rainMm });

describe('the tasks of a planting', () => {
  it('thins radish soon after it comes up and side-dresses it 3–4 weeks after (radish: common practice)', () => {
    const p = planting(radish);
    const up = p.dates!.emergence!.expected;
    const tasks = tasksForPlanting(p, ctx('2026-04-01'));
    const thin = tasks.find((t) => t.kind === 'thin')!;
    expect(thin.dueOn).toBe(plusDays(up, 7));
    expect(thin.details).toContain('2.54–5.08 cm');
    const feed = tasks.find((t) => t.kind === 'side_dress')!;
    expect([feed.windowFrom, feed.windowTo]).toEqual([plusDays(up, 21), plusDays(up, 28)]);
    // Fertiliser: the usual caution goes with it.
    expect(feed.caution).toMatch(/product label/);
  });

  it('weeds weekly from a week after sowing until four weeks after the crop is up (common practice)', () => {
    const p = planting(lettuce, { plantedOn: '2026-05-01' });
    const up = p.dates!.emergence!.expected;
    const weeds = tasksForPlanting(p, ctx('2026-04-01')).filter((t) => t.kind === 'weed');
    expect(weeds[0].dueOn).toBe('2026-05-08');
    for (let i = 1; i < weeds.length; i++) expect(weeds[i].dueOn).toBe(plusDays(weeds[i - 1].dueOn, 7));
    expect(weeds[weeds.length - 1].dueOn <= plusDays(up, WEEDING_WEEKS_AFTER_EMERGENCE * 7)).toBe(true);
    expect(plusDays(weeds[weeds.length - 1].dueOn, 7) > plusDays(up, WEEDING_WEEKS_AFTER_EMERGENCE * 7)).toBe(true);
  });

  it('gives the harvest window from the crop notes and scouts for the pests they list until then', () => {
    const p = planting(radish);
    const tasks = tasksForPlanting(p, ctx('2026-04-01'));
    const harvest = tasks.find((t) => t.kind === 'harvest')!;
    expect([harvest.windowFrom, harvest.windowTo]).toEqual([p.dates!.harvest.earliest, p.dates!.harvest.latest]);
    const scout = tasks.filter((t) => t.kind === 'scout');
    expect(scout.length).toBeGreaterThan(0);
    expect(scout[0].details).toMatch(/flea beetle/i);
    expect(scout.every((t) => t.dueOn < harvest.windowFrom)).toBe(true);
    // Radish is quick (25–50 days, Britannica): not worth mulching.
    expect(tasks.some((t) => t.kind === 'mulch')).toBe(false);
  });

  it('plans nothing whose window has closed, and nothing for a finished planting', () => {
    const p = planting(radish);
    const later = tasksForPlanting(p, ctx('2026-05-01'));
    expect(later.every((t) => t.windowTo >= '2026-05-01')).toBe(true);
    const closed = tasksForPlanting(p, ctx('2026-04-01')).filter((t) => t.windowTo < '2026-05-01');
    expect(closed.length).toBeGreaterThan(0);
    const laterKeys = new Set(later.map((t) => t.genKey));
    expect(closed.filter((t) => laterKeys.has(t.genKey))).toEqual([]);
    expect(tasksForPlanting({ ...p, status: 'finished' }, ctx('2026-04-01'))).toEqual([]);
  });

  it('is the same every time for the same input', () => {
    const p = planting(lettuce, { plantedOn: '2026-05-01' });
    expect(tasksForPlanting(p, ctx('2026-06-24'))).toEqual(tasksForPlanting(p, ctx('2026-06-24')));
  });
});

describe('watering', () => {
  // Lettuce, FAO-56 Table 11 stages 20/30/15/10 days and Table 12 Kc 0.7/1.00/0.95: planted on 1 May,
  // its mid-season stage runs from day 50 to day 65, so the week of Monday 22 June (days 52–58) is all at Kc 1.00.
  const p = planting(lettuce, { plantedOn: '2026-05-01', method: 'transplanted', dates: plantingDates({ crop: lettuce, method: 'transplanted', date: '2026-05-01' }) });
  const week = (rain: number[]) => Array.from({ length: 7 }, (_, i) => rainOnly(plusDays('2026-06-22', i), rain[i] ?? 0));

  it('needs the rule of thumb’s 25 mm a week at Kc 1.00 where the log has only rain, less the rain (UF/IFAS, Purdue: about 1 inch a week; computed)', () => {
    const w = waterWeek(p, ctx('2026-06-28', week([4, 0, 5])), '2026-06-22')!;
    expect(w.meanKc).toBeCloseTo(1.0, 10);
    expect(w.needMm).toBeCloseTo(25, 10);
    expect(w.rainMm).toBe(9);
    expect(w.deficitMm).toBeCloseTo(16, 10);
    expect(w.methods).toEqual({ rule_of_thumb: 7 });
  });

  it('asks for the deficit as litres over the area planted (1 mm over 1 m² = 1 L) and explains the sum', () => {
    const tasks = tasksForPlanting(p, ctx('2026-06-28', week([4, 0, 5])));
    const water = tasks.find((t) => t.kind === 'water' && t.genKey === 'water:2026-06-22')!;
    expect(water.amountMm).toBe(16);
    expect(water.amountL).toBe(48);
    expect(water.title).toBe('Water the lettuce: 48 L');
    expect(water.details).toContain('need 25 mm this week');
    expect(water.details).toContain('Kc 1.00');
    expect(water.details).toContain('rain logged 9 mm, deficit 16 mm');
  });

  it('shows US gallons on a US site: 48 L is 12.7 US gal (1 US gal = 3.785411784 L, NIST Handbook 44)', () => {
    const water = tasksForPlanting(p, ctx('2026-06-28', week([4, 0, 5]), 'us')).find((t) => t.genKey === 'water:2026-06-22')!;
    expect(water.title).toBe('Water the lettuce: 12.7 US gal');
    expect(water.details).toContain('0.63 in');
    // computed: the rule of thumb's 25/7 mm a day = 3.571 mm ÷ 25.4 mm/in = 0.14 in/day
    expect(water.details).toContain('ET0 0.14 in/day');
    expect(water.details).not.toContain('mm/day');
  });

  it('asks for no watering in a week with enough rain logged', () => {
    const tasks = tasksForPlanting(p, ctx('2026-06-28', week([10, 0, 12, 0, 6])));
    expect(tasks.some((t) => t.genKey === 'water:2026-06-22')).toBe(false);
  });

  it('leaves out a deficit too small to be worth the trip', () => {
    const w = waterWeek(p, ctx('2026-06-28', week([10, 0, 11])), '2026-06-22')!;
    expect(w.deficitMm).toBeLessThan(WATER_MIN_DEFICIT_MM);
    expect(tasksForPlanting(p, ctx('2026-06-28', week([10, 0, 11]))).some((t) => t.genKey === 'water:2026-06-22')).toBe(false);
  });

  it('needs more in a raised bed, by the club’s factor', () => {
    const inGround = waterWeek(p, ctx('2026-06-28', week([])), '2026-06-22')!;
    const raised = waterWeek({ ...p, plotKind: 'raised_bed' }, ctx('2026-06-28', week([])), '2026-06-22')!;
    expect(raised.needMm).toBeCloseTo(inGround.needMm * 1.2, 10);
  });

  it('plans only this week and the next', () => {
    const keys = tasksForPlanting(p, ctx('2026-06-24')).filter((t) => t.kind === 'water').map((t) => t.genKey);
    expect(keys).toEqual(['water:2026-06-22', 'water:2026-06-29']);
  });
});

describe('weeks', () => {
  it('start on Monday (ISO 8601)', () => {
    expect(weekStartOf('2026-06-28')).toBe('2026-06-22'); // a Sunday
    expect(weekStartOf('2026-06-22')).toBe('2026-06-22');
    expect(weekStartOf('2026-01-01')).toBe('2025-12-29'); // a Thursday
  });
});
