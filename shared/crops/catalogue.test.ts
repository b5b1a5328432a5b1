import { describe, expect, it } from 'vitest';
import {
  companionCaution,
  cropBySlug,
  cropRelations,
  crops,
  cropSources,
  defaultRotationGap,
  defaultRotationGapYears,
  diseaseRotationRules,
  pestBySlug,
  pestsAndDiseases,
  type Crop,
} from './index';

// Conversions done here, from the printed figures, so a wrong conversion in the data shows.
const in2cm = (inches: number) => inches * 2.54;
const f2c = (f: number) => ((f - 32) * 5) / 9;

const sourceIds = new Set(cropSources.map((s) => s.id));

type Found = { path: string; source: unknown; hasValue: boolean };

/** Every object anywhere below `root` that carries a `source` or a `value`, with its path. */
function sourcedNodes(root: unknown, path = '$'): Found[] {
  if (root === null || typeof root !== 'object') return [];
  const out: Found[] = [];
  const obj = root as Record<string, unknown>;
  if (!Array.isArray(root) && ('source' in obj || 'value' in obj)) {
    out.push({ path, source: obj.source, hasValue: 'value' in obj });
  }
  for (const [k, v] of Object.entries(obj)) out.push(...sourcedNodes(v, `${path}.${k}`));
  return out;
}

/** Every {min, max} object anywhere below `root`. */
function ranges(root: unknown, path = '$'): { path: string; min: number; max: number }[] {
  if (root === null || typeof root !== 'object') return [];
  const obj = root as Record<string, unknown>;
  const out: { path: string; min: number; max: number }[] = [];
  if (typeof obj.min === 'number' || typeof obj.max === 'number') {
    out.push({ path, min: obj.min as number, max: obj.max as number });
  }
  for (const [k, v] of Object.entries(obj)) out.push(...ranges(v, `${path}.${k}`));
  return out;
}

const everything = { crops, diseaseRotationRules, defaultRotationGap, cropRelations, pestsAndDiseases, companionCaution };

function crop(slug: string): Crop {
  const c = cropBySlug(slug);
  if (!c) throw new Error(`no crop ${slug}`);
  return c;
}

describe('sources', () => {
  it('has unique ids and the two honest marks', () => {
    expect(new Set(cropSources.map((s) => s.id)).size).toBe(cropSources.length);
    expect(cropSources.find((s) => s.id === 'common-practice')?.evidence).toBe('common_practice');
    expect(cropSources.find((s) => s.id === 'from-memory')?.evidence).toBe('from_memory');
  });

  it('every sourced value anywhere in the data names a listed source', () => {
    const nodes = sourcedNodes(everything);
    // Relations and pests carry `source` directly; the rest are Sourced<T> values.
    expect(nodes.length).toBeGreaterThan(crops.length * 20);
    const bad = nodes.filter((n) => typeof n.source !== 'string' || !sourceIds.has(n.source));
    expect(bad).toEqual([]);
  });

  it('every crop field other than names, kind, watch list and guidance is a Sourced value', () => {
    const plain = new Set(['slug', 'commonName', 'kind', 'watchFor', 'guidance']);
    for (const c of crops) {
      for (const [k, v] of Object.entries(c)) {
        if (plain.has(k)) continue;
        expect(v, `${c.slug}.${k}`).toHaveProperty('value');
        expect(typeof (v as { source: unknown }).source, `${c.slug}.${k}`).toBe('string');
      }
    }
  });
});

describe('catalogue shape', () => {
  it('has at least 30 crops with unique slugs found by cropBySlug', () => {
    expect(crops.length).toBeGreaterThanOrEqual(30);
    expect(new Set(crops.map((c) => c.slug)).size).toBe(crops.length);
    for (const c of crops) expect(cropBySlug(c.slug)).toBe(c);
    expect(cropBySlug('no-such-crop')).toBeUndefined();
  });

  it('holds the crops community gardens grow', () => {
    const wanted = [
      'radish', 'turnip', 'beet', 'chard', 'spinach', 'carrot', 'parsnip', 'lettuce', 'cabbage', 'broccoli',
      'kale', 'potato', 'tomato', 'sweet-pepper', 'eggplant', 'cucumber', 'zucchini', 'winter-squash',
      'bush-bean', 'pea', 'sweet-corn', 'onion', 'garlic', 'leek', 'basil', 'parsley', 'dill', 'chives',
      'coriander', 'french-marigold', 'nasturtium', 'sunflower',
    ];
    for (const slug of wanted) expect(cropBySlug(slug), slug).toBeDefined();
  });

  it('has min ≤ max in every range, and no negative ones', () => {
    const all = ranges(everything);
    expect(all.length).toBeGreaterThan(crops.length * 10);
    for (const r of all) {
      expect(Number.isFinite(r.min) && Number.isFinite(r.max), r.path).toBe(true);
      expect(r.min, r.path).toBeLessThanOrEqual(r.max);
    }
    for (const c of crops) {
      for (const k of ['inRowCm', 'betweenRowCm', 'equalSpacingCm', 'sowingDepthCm', 'rootingDepthCm', 'matureHeightCm'] as const) {
        expect(c[k].value.min, `${c.slug}.${k}`).toBeGreaterThan(0);
      }
    }
  });

  it('has germination min ≤ optimum ≤ max for every crop', () => {
    for (const c of crops) {
      const g = c.germination.value;
      expect(g.minC, c.slug).toBeLessThanOrEqual(g.optimumC.min);
      expect(g.optimumC.min, c.slug).toBeLessThanOrEqual(g.optimumC.max);
      expect(g.optimumC.max, c.slug).toBeLessThanOrEqual(g.maxC);
    }
  });

  it('keeps soil pH within 4–9 and days to emergence before days to maturity', () => {
    for (const c of crops) {
      expect(c.soilPh.value.min, c.slug).toBeGreaterThanOrEqual(4);
      expect(c.soilPh.value.max, c.slug).toBeLessThanOrEqual(9);
      expect(c.daysToEmergence.value.max, c.slug).toBeLessThan(c.daysToMaturity.value.min);
    }
  });

  it('names only listed pests in every watch list', () => {
    for (const c of crops) {
      expect(c.watchFor.length, c.slug).toBeGreaterThan(0);
      for (const p of c.watchFor) expect(pestBySlug(p), `${c.slug} → ${p}`).toBeDefined();
    }
    expect(new Set(pestsAndDiseases.map((p) => p.slug)).size).toBe(pestsAndDiseases.length);
  });

  it('adds the safety caution to every guidance text that mentions sprays, soaps, oils, lime, manure or fertiliser', () => {
    const risky = /\b(spray|soap|oil|lime|liming|manur|fertili[sz])\w*/i;
    let seen = 0;
    for (const c of crops) {
      for (const [k, text] of Object.entries(c.guidance)) {
        expect(text.length, `${c.slug}.${k}`).toBeGreaterThan(10);
        if (risky.test(text)) {
          seen += 1;
          expect(text, `${c.slug}.${k}`).toMatch(/follow the product label/i);
          expect(text, `${c.slug}.${k}`).toMatch(/pollinators/i);
          expect(text, `${c.slug}.${k}`).toMatch(/local regulations/i);
        }
      }
    }
    expect(seen).toBeGreaterThan(10);
    for (const rule of diseaseRotationRules) {
      if (rule.suppression && risky.test(rule.suppression.value)) {
        expect(rule.suppression.value).toMatch(/follow the product label/i);
      }
    }
  });
});

describe('families (WVU / UC Master Gardeners, current APG names)', () => {
  const families: [string, string][] = [
    ['tomato', 'Solanaceae'], ['sweet-pepper', 'Solanaceae'], ['eggplant', 'Solanaceae'], ['potato', 'Solanaceae'],
    ['cabbage', 'Brassicaceae'], ['broccoli', 'Brassicaceae'], ['kale', 'Brassicaceae'], ['radish', 'Brassicaceae'],
    ['turnip', 'Brassicaceae'], ['pea', 'Fabaceae'], ['bush-bean', 'Fabaceae'], ['carrot', 'Apiaceae'],
    ['parsnip', 'Apiaceae'], ['parsley', 'Apiaceae'], ['dill', 'Apiaceae'], ['coriander', 'Apiaceae'],
    ['beet', 'Amaranthaceae'], ['chard', 'Amaranthaceae'], ['spinach', 'Amaranthaceae'],
    ['cucumber', 'Cucurbitaceae'], ['zucchini', 'Cucurbitaceae'], ['winter-squash', 'Cucurbitaceae'],
    ['onion', 'Amaryllidaceae'], ['garlic', 'Amaryllidaceae'], ['leek', 'Amaryllidaceae'], ['chives', 'Amaryllidaceae'],
    ['lettuce', 'Asteraceae'], ['sweet-corn', 'Poaceae'],
    // Outside the WVU list: from memory.
    ['basil', 'Lamiaceae'], ['french-marigold', 'Asteraceae'], ['sunflower', 'Asteraceae'], ['nasturtium', 'Tropaeolaceae'],
  ];
  it.each(families)('%s is in %s', (slug, family) => {
    expect(crop(slug).family.value).toBe(family);
  });
  it('uses no former family names', () => {
    for (const c of crops) expect(c.family.value).not.toMatch(/Chenopodiaceae|Alliaceae|Cruciferae|Leguminosae|Umbelliferae|Compositae/);
  });
});

describe('cited rows against the data', () => {
  // [crop, field, printed min in, printed max in]
  const umaine: [string, 'inRowCm' | 'betweenRowCm' | 'sowingDepthCm', number, number][] = [
    ['bush-bean', 'betweenRowCm', 24, 24], ['bush-bean', 'inRowCm', 2, 4], ['bush-bean', 'sowingDepthCm', 1, 1],
    ['beet', 'betweenRowCm', 12, 18], ['beet', 'inRowCm', 2, 3], ['beet', 'sowingDepthCm', 0.5, 0.5],
    ['broccoli', 'betweenRowCm', 24, 36], ['broccoli', 'inRowCm', 24, 30],
    ['cabbage', 'betweenRowCm', 24, 36], ['cabbage', 'inRowCm', 12, 18],
    ['carrot', 'betweenRowCm', 12, 18], ['carrot', 'inRowCm', 2, 3], ['carrot', 'sowingDepthCm', 0.5, 0.5],
    ['sweet-corn', 'betweenRowCm', 24, 36], ['sweet-corn', 'inRowCm', 6, 8], ['sweet-corn', 'sowingDepthCm', 1, 1],
    ['cucumber', 'betweenRowCm', 48, 72], ['cucumber', 'inRowCm', 48, 48], ['cucumber', 'sowingDepthCm', 0.75, 0.75],
    ['onion', 'betweenRowCm', 12, 18], ['onion', 'inRowCm', 1, 3], ['onion', 'sowingDepthCm', 0.5, 0.5],
    ['pea', 'betweenRowCm', 18, 36], ['pea', 'inRowCm', 1, 2], ['pea', 'sowingDepthCm', 1, 1],
    ['sweet-pepper', 'betweenRowCm', 18, 24], ['sweet-pepper', 'inRowCm', 18, 18],
    ['potato', 'betweenRowCm', 30, 36], ['potato', 'inRowCm', 8, 12], ['potato', 'sowingDepthCm', 4, 6],
    ['spinach', 'betweenRowCm', 12, 18], ['spinach', 'inRowCm', 3, 4], ['spinach', 'sowingDepthCm', 0.5, 0.5],
    ['zucchini', 'betweenRowCm', 36, 36], ['zucchini', 'inRowCm', 48, 48], ['zucchini', 'sowingDepthCm', 1, 1],
    ['tomato', 'betweenRowCm', 24, 48], ['tomato', 'inRowCm', 18, 36],
    ['turnip', 'betweenRowCm', 12, 18], ['turnip', 'inRowCm', 1, 1], ['turnip', 'sowingDepthCm', 0.25, 0.5],
  ];
  it.each(umaine)('UMaine planting chart: %s %s %s–%s in', (slug, field, lo, hi) => {
    const v = crop(slug)[field];
    expect(v.source).toBe('umaine-planting-chart');
    expect(v.value.min).toBeCloseTo(in2cm(lo), 6);
    expect(v.value.max).toBeCloseTo(in2cm(hi), 6);
  });

  it.each(['broccoli', 'cabbage', 'sweet-pepper', 'tomato'])('UMaine planting chart: %s is printed "transplant"', (slug) => {
    expect(crop(slug).sowing).toMatchObject({ value: 'transplant', source: 'umaine-planting-chart' });
  });

  const arizona: [string, number, number][] = [
    ['radish', 2, 3], ['carrot', 2, 3], ['beet', 2, 4], ['onion', 2, 4], ['lettuce', 4, 6],
    ['spinach', 4, 6], ['bush-bean', 4, 6], ['sweet-pepper', 12, 15], ['tomato', 18, 24],
  ];
  it.each(arizona)('University of Arizona intensive spacing: %s %s–%s in', (slug, lo, hi) => {
    const v = crop(slug).equalSpacingCm;
    expect(v.source).toBe('uarizona-intensive');
    expect(v.value.min).toBeCloseTo(in2cm(lo), 6);
    expect(v.value.max).toBeCloseTo(in2cm(hi), 6);
  });

  // [crop, min °F, optimum low, optimum high, max °F]
  const osu: [string, number, number, number, number][] = [
    ['bush-bean', 60, 60, 85, 95], ['beet', 40, 50, 85, 95], ['cabbage', 40, 45, 95, 100], ['carrot', 40, 45, 85, 95],
    ['sweet-corn', 50, 60, 95, 105], ['cucumber', 60, 60, 95, 105], ['lettuce', 35, 40, 80, 95], ['onion', 35, 50, 95, 95],
    ['pea', 40, 40, 75, 85], ['sweet-pepper', 60, 65, 95, 95], ['radish', 40, 45, 90, 95], ['spinach', 35, 45, 75, 85],
    ['zucchini', 60, 70, 95, 100], ['winter-squash', 60, 70, 95, 100], ['tomato', 50, 60, 85, 95], ['turnip', 40, 60, 105, 105],
    // Rows read on the OSU page itself through the search tool (not in sources.md).
    ['chard', 40, 50, 85, 95], ['eggplant', 60, 75, 90, 95], ['parsley', 40, 50, 85, 90], ['parsnip', 35, 50, 70, 85],
  ];
  it.each(osu)('OSU germination: %s %s / %s–%s / %s °F', (slug, min, lo, hi, max) => {
    const g = crop(slug).germination;
    expect(g.source).toBe('osu-germination');
    expect(g.value.minC).toBeCloseTo(f2c(min), 6);
    expect(g.value.optimumC.min).toBeCloseTo(f2c(lo), 6);
    expect(g.value.optimumC.max).toBeCloseTo(f2c(hi), 6);
    expect(g.value.maxC).toBeCloseTo(f2c(max), 6);
  });

  const harrington: [string, (number | null)[]][] = [
    ['radish', [11, 6, 4, 4, 3]], ['lettuce', [7, 4, 3, 2, 3]], ['carrot', [17, 10, 7, 6, 6]], ['beet', [17, 10, 6, 5, 5]],
    ['tomato', [43, 14, 8, 6, 6]], ['bush-bean', [null, 16, 11, 8, 6]], ['sweet-pepper', [null, 25, 13, 8, 8]],
  ];
  it.each(harrington)('Harrington emergence days at 50/59/68/77/86 °F: %s', (slug, days) => {
    const e = crop(slug).emergenceByTemperature;
    expect(e?.source).toBe('harrington-emergence');
    expect(e?.value).toEqual(days);
  });

  // The OSU page's days-to-seedlings table (seed at ½ in), read through the search tool.
  const osuEmergence: [string, (number | null)[]][] = [
    ['cabbage', [15, 9, 6, 4, 3]], ['sweet-corn', [22, 12, 7, 4, 4]], ['cucumber', [null, 13, 6, 4, 3]],
  ];
  it.each(osuEmergence)('OSU days to seedlings at 50/59/68/77/86 °F: %s', (slug, days) => {
    const e = crop(slug).emergenceByTemperature;
    expect(e?.source).toBe('osu-germination');
    expect(e?.value).toEqual(days);
  });

  // [crop, °F, RH low, RH high, months low, months high]
  const umass: [string, number, number, number, number, number][] = [
    ['beet', 32, 95, 95, 4, 6], ['turnip', 32, 95, 95, 4, 5], ['cabbage', 32, 98, 100, 4, 6],
    ['carrot', 32, 98, 100, 5, 9], ['garlic', 32, 65, 70, 6, 7], ['parsnip', 32, 90, 95, 2, 6],
  ];
  it.each(umass)('UMass storage: %s at %s °F, %s–%s %% RH, %s–%s months', (slug, f, hLo, hHi, mLo, mHi) => {
    const st = crop(slug).storage;
    expect(st.source).toBe('umass-storage');
    expect(st.value.temperatureC.min).toBeCloseTo(f2c(f), 6);
    expect(st.value.temperatureC.max).toBeCloseTo(f2c(f), 6);
    expect(st.value.humidityPct).toEqual({ min: hLo, max: hHi });
    // A month is taken as 30 days (the note says so).
    expect(st.value.days).toEqual({ min: mLo * 30, max: mHi * 30 });
  });

  // [crop, °F low, °F high, RH low, RH high, life low, life high, days per unit] from Table 16 of the
  // New England guide; a week is 7 days and a month 30 (the notes say so).
  const table16: [string, number, number, number, number, number, number, number][] = [
    ['lettuce', 32, 36, 95, 95, 2, 3, 7], ['broccoli', 32, 32, 90, 95, 1, 2, 7], ['kale', 32, 32, 90, 95, 1, 2, 7],
    ['sweet-pepper', 45, 50, 90, 95, 2, 3, 7], ['eggplant', 50, 50, 90, 95, 1, 1, 7], ['cucumber', 50, 50, 90, 95, 1, 2, 7],
    ['bush-bean', 40, 45, 90, 95, 7, 10, 1], ['pea', 32, 32, 90, 95, 1, 2, 7], ['onion', 32, 32, 65, 70, 1, 8, 30],
    ['leek', 32, 32, 90, 95, 1, 3, 30], ['basil', 46, 50, 90, 95, 4, 7, 1], ['parsley', 32, 32, 95, 95, 1, 2, 30],
  ];
  it.each(table16)('New England Table 16 storage: %s at %s–%s °F, %s–%s %% RH', (slug, fLo, fHi, hLo, hHi, lLo, lHi, per) => {
    const st = crop(slug).storage;
    expect(st.source).toBe('nevmg-table16');
    expect(st.value.temperatureC.min).toBeCloseTo(f2c(fLo), 6);
    expect(st.value.temperatureC.max).toBeCloseTo(f2c(fHi), 6);
    expect(st.value.humidityPct).toEqual({ min: hLo, max: hHi });
    expect(st.value.days).toEqual({ min: lLo * per, max: lHi * per });
  });

  // [crop, Purdue column, catalogue word]: very hardy reads as hardy, frost tolerant as half-hardy,
  // tender and warm loving as tender.
  const purdue: [string, string, string][] = [
    ['radish', 'frost tolerant', 'half_hardy'], ['turnip', 'very hardy', 'hardy'], ['beet', 'frost tolerant', 'half_hardy'],
    ['chard', 'frost tolerant', 'half_hardy'], ['spinach', 'very hardy', 'hardy'], ['carrot', 'frost tolerant', 'half_hardy'],
    ['parsnip', 'frost tolerant', 'half_hardy'], ['lettuce', 'very hardy', 'hardy'], ['cabbage', 'frost tolerant', 'half_hardy'],
    ['broccoli', 'frost tolerant', 'half_hardy'], ['kale', 'very hardy', 'hardy'], ['tomato', 'tender', 'tender'],
    ['sweet-pepper', 'warm loving', 'tender'], ['eggplant', 'warm loving', 'tender'], ['cucumber', 'warm loving', 'tender'],
    ['zucchini', 'warm loving', 'tender'], ['winter-squash', 'warm loving', 'tender'], ['bush-bean', 'tender', 'tender'],
    ['pea', 'very hardy', 'hardy'], ['sweet-corn', 'tender', 'tender'], ['onion', 'very hardy', 'hardy'],
  ];
  it.each(purdue)('Purdue frost resistance: %s in the %s column reads as %s', (slug, column, word) => {
    const f = crop(slug).frost;
    expect(f.source).toBe('purdue-frost-resistance');
    expect(f.value).toBe(word);
    expect(f.note).toContain(`column '${column}'`);
  });

  it('takes potato from Purdue’s very hardy column: seed tubers are planted weeks before the last frost', () => {
    const f = crop('potato').frost;
    expect(f).toMatchObject({ value: 'hardy', source: 'purdue-frost-resistance' });
    expect(f.note).toContain("column 'very hardy'");
  });

  // [crop, days at 50/59/68/77/86 °F as printed in Appendix 4 (null: not tested)]
  const appendix4: [string, (number | null)[]][] = [
    ['turnip', [5, 3, 2, 1, 1]], ['beet', [17, 10, 6, 5, 5]], ['spinach', [12, 7, 6, 5, 6]], ['carrot', [17, 10, 7, 6, 6]],
    ['parsnip', [27, 19, 14, 15, 32]], ['lettuce', [7, 4, 3, 2, 3]], ['cabbage', [15, 9, 6, 5, 4]], ['tomato', [43, 14, 8, 6, 6]],
    ['sweet-pepper', [null, 25, 13, 8, 8]], ['eggplant', [null, null, 13, 8, 5]], ['cucumber', [null, 13, 6, 4, 3]],
    ['bush-bean', [null, 16, 11, 8, 6]], ['pea', [14, 9, 8, 6, 6]], ['sweet-corn', [22, 12, 7, 4, 4]], ['onion', [13, 7, 5, 4, 4]],
    ['parsley', [29, 17, 14, 13, 12]],
  ];
  it.each(appendix4)('Appendix 4 emergence: %s, days to emergence spans the 59–86 °F columns', (slug, row) => {
    const d = crop(slug).daysToEmergence;
    expect(d.source).toBe('tofg-emergence-span');
    const warm = row.slice(1).filter((x): x is number => x !== null);
    expect(d.value).toEqual({ min: Math.min(...warm), max: Math.max(...warm) });
  });
  it.each(appendix4.filter(([slug]) => ['turnip', 'spinach', 'parsnip', 'pea', 'onion', 'parsley'].includes(slug)))(
    'Appendix 4 emergence table: %s',
    (slug, row) => {
      expect(crop(slug).emergenceByTemperature).toMatchObject({ value: row, source: 'tofg-emergence' });
    },
  );

  // [crop, botanical name, source] as read on each page.
  const botanical: [string, string, string][] = [
    ['cucumber', 'Cucumis sativus', 'wisc-a3688-vine-crops'], ['zucchini', 'Cucurbita pepo', 'wisc-a3688-vine-crops'],
    ['tomato', 'Solanum lycopersicum', 'vt-seed-production-solanaceae'], ['radish', 'Raphanus sativus', 'se-vegetable-handbook-2021'],
    ['turnip', 'Brassica rapa var. rapa', 'se-vegetable-handbook-2021'], ['parsnip', 'Pastinaca sativa', 'ufifas-plant-id-parsnip'],
    ['eggplant', 'Solanum melongena', 'unl-extension-eggplant-1982'],
  ];
  it.each(botanical)('botanical name: %s is %s (%s)', (slug, name, source) => {
    expect(crop(slug).botanicalName).toMatchObject({ value: name, source });
  });

  it('spinach storage from the PMC3602570 Table 4 row: 0 °C, 95 % RH, 1–2 weeks', () => {
    expect(crop('spinach').storage).toMatchObject({
      value: { temperatureC: { min: 0, max: 0 }, humidityPct: { min: 95, max: 95 }, days: { min: 7, max: 14 } },
      source: 'pmc3602570-table4',
    });
  });

  // [crop, min days, max days, from]
  const britannica: [string, number, number, 'sowing' | 'transplanting'][] = [
    ['bush-bean', 50, 60, 'sowing'], ['beet', 60, 70, 'sowing'], ['broccoli', 50, 80, 'transplanting'],
    ['cabbage', 70, 100, 'transplanting'], ['carrot', 70, 80, 'sowing'], ['cucumber', 50, 70, 'sowing'],
    ['garlic', 180, 180, 'sowing'], ['lettuce', 60, 80, 'transplanting'], ['onion', 100, 150, 'transplanting'],
    ['pea', 60, 75, 'sowing'], ['sweet-pepper', 70, 80, 'transplanting'], ['potato', 90, 120, 'sowing'],
    ['radish', 25, 50, 'sowing'], ['spinach', 40, 50, 'sowing'], ['zucchini', 45, 60, 'sowing'],
    ['sweet-corn', 75, 100, 'sowing'], ['tomato', 70, 90, 'transplanting'],
  ];
  it.each(britannica)('Britannica days to maturity: %s %s–%s from %s', (slug, lo, hi, from) => {
    const m = crop(slug).daysToMaturity;
    expect(m.source).toBe('britannica-maturity');
    expect(m.value).toEqual({ min: lo, max: hi, from });
  });

  // [crop, Kc ini, Kc mid, Kc end low, Kc end high, max height m]
  const table12: [string, number, number, number, number, number][] = [
    ['radish', 0.7, 0.9, 0.85, 0.85, 0.3], ['lettuce', 0.7, 1.0, 0.95, 0.95, 0.3], ['spinach', 0.7, 1.0, 0.95, 0.95, 0.3],
    ['carrot', 0.7, 1.05, 0.95, 0.95, 0.3], ['beet', 0.5, 1.05, 0.95, 0.95, 0.4], ['cabbage', 0.7, 1.05, 0.95, 0.95, 0.4],
    ['broccoli', 0.7, 1.05, 0.95, 0.95, 0.3], ['tomato', 0.6, 1.15, 0.7, 0.9, 0.6], ['bush-bean', 0.5, 1.05, 0.9, 0.9, 0.4],
    ['pea', 0.5, 1.15, 1.1, 1.1, 0.5], ['cucumber', 0.6, 1.0, 0.75, 0.75, 0.3], ['zucchini', 0.5, 0.95, 0.75, 0.75, 0.3],
    ['winter-squash', 0.5, 1.0, 0.8, 0.8, 0.4], ['potato', 0.5, 1.15, 0.75, 0.75, 0.6], ['onion', 0.7, 1.05, 0.75, 0.75, 0.4],
    ['garlic', 0.7, 1.0, 0.7, 0.7, 0.3], ['sweet-corn', 0.3, 1.15, 1.05, 1.05, 1.5], ['sweet-pepper', 0.6, 1.05, 0.9, 0.9, 0.7],
  ];
  it.each(table12)('FAO-56 Table 12: %s Kc %s / %s / %s–%s, height %s m', (slug, ini, mid, endLo, endHi, hM) => {
    const c = crop(slug);
    expect(c.kc?.source).toBe('fao56-table12');
    expect(c.kc?.value).toEqual({ initial: ini, mid, end: { min: endLo, max: endHi } });
    expect(c.matureHeightCm.source).toBe('fao56-table12');
    expect(c.matureHeightCm.value.max).toBeCloseTo(hM * 100, 6);
  });

  // Table 12 heights only, for crops whose Kc is not in the catalogue.
  const table12Heights: [string, number][] = [['turnip', 0.6], ['parsnip', 0.4], ['eggplant', 0.8], ['sunflower', 2.0]];
  it.each(table12Heights)('FAO-56 Table 12 maximum height: %s %s m', (slug, hM) => {
    const h = crop(slug).matureHeightCm;
    expect(h.source).toBe('fao56-table12');
    expect(h.value.min).toBeCloseTo(hM * 100, 6);
    expect(h.value.max).toBeCloseTo(hM * 100, 6);
  });

  // [crop, initial, development, mid, late, printed total]
  const table11: [string, number, number, number, number, number][] = [
    ['radish', 5, 10, 15, 5, 35], ['lettuce', 20, 30, 15, 10, 75], ['beet', 15, 25, 20, 10, 70], ['carrot', 20, 30, 30, 20, 100],
    ['bush-bean', 20, 30, 30, 10, 90], ['pea', 15, 25, 35, 15, 90], ['tomato', 30, 40, 45, 30, 145],
    ['zucchini', 25, 35, 25, 15, 100], ['cucumber', 20, 30, 40, 15, 105], ['sweet-corn', 20, 25, 25, 10, 80],
    ['potato', 30, 35, 50, 30, 145], ['broccoli', 35, 45, 40, 15, 135], ['cabbage', 40, 60, 50, 15, 165],
    ['sweet-pepper', 30, 35, 40, 20, 125],
  ];
  it.each(table11)('FAO-56 Table 11 stage lengths: %s %s/%s/%s/%s = %s days', (slug, a, b, m, l, total) => {
    const s = crop(slug).stages;
    expect(s?.source).toBe('fao56-table11');
    expect(s?.value).toEqual({ initial: a, development: b, mid: m, late: l });
    const v = s!.value;
    expect(v.initial + v.development + v.mid + v.late).toBe(total);
  });

  // [crop, Zr low m, Zr high m], as printed in Table 22 (pyfao56 tables file).
  const table22: [string, number, number][] = [
    ['turnip', 0.5, 1.0], ['beet', 0.6, 1.0], ['spinach', 0.3, 0.5], ['carrot', 0.5, 1.0], ['parsnip', 0.5, 1.0],
    ['lettuce', 0.3, 0.5], ['cabbage', 0.5, 0.8], ['broccoli', 0.4, 0.6], ['potato', 0.4, 0.6], ['tomato', 0.7, 1.5],
    ['sweet-pepper', 0.5, 1.0], ['eggplant', 0.7, 1.2], ['cucumber', 0.7, 1.2], ['zucchini', 0.6, 1.0],
    ['winter-squash', 1.0, 1.5], ['bush-bean', 0.5, 0.7], ['pea', 0.6, 1.0], ['sweet-corn', 0.8, 1.2],
    ['onion', 0.3, 0.6], ['garlic', 0.3, 0.5], ['sunflower', 0.8, 1.5],
  ];
  it.each(table22)('FAO-56 Table 22 rooting depth: %s %s–%s m', (slug, lo, hi) => {
    const z = crop(slug).rootingDepthCm;
    expect(z.source).toBe('fao56-table22');
    expect(z.value.min).toBeCloseTo(lo * 100, 6);
    expect(z.value.max).toBeCloseTo(hi * 100, 6);
  });

  it('leaves spinach stage lengths out (Table 11 rows unconfirmed)', () => {
    expect(crop('spinach').stages).toBeUndefined();
  });
});

describe('least soil depth for raised beds and containers', () => {
  // Whole centimetres: the catalogue rounds printed inches × 2.54 to the nearest cm (a plot's soil
  // depth is measured to the centimetre).
  const in2wholeCm = (inches: number) => Math.round(in2cm(inches));

  it('is given for every crop, in cm, with the raised bed never below the container', () => {
    for (const c of crops) {
      const d = c.minSoilDepthCm;
      expect(d, c.slug).toBeDefined();
      expect(sourceIds.has(d!.source), c.slug).toBe(true);
      expect(d!.value.container, c.slug).toBeGreaterThan(0);
      expect(d!.value.raisedBed, c.slug).toBeGreaterThanOrEqual(d!.value.container);
      // A unit slip (inches or metres) would land far outside 5–100 cm.
      expect(d!.value.container, c.slug).toBeGreaterThanOrEqual(5);
      expect(d!.value.raisedBed, c.slug).toBeLessThanOrEqual(100);
    }
  });

  it('gives radish 20 cm (8 in) in a raised bed and 10 cm (4 in) in a container, as common practice', () => {
    expect(crop('radish').minSoilDepthCm).toMatchObject({ value: { raisedBed: 20, container: 10 }, source: 'common-practice' });
    expect(in2wholeCm(8)).toBe(20);
    expect(in2wholeCm(4)).toBe(10);
  });

  it('says from memory in the note of every from-memory value', () => {
    for (const c of crops) {
      const d = c.minSoilDepthCm!;
      if (d.source === 'from-memory') expect(d.note, c.slug).toMatch(/from memory/);
    }
  });

  it('lists the University of Maryland Extension page as a published source with its address', () => {
    const s = cropSources.find((x) => x.id === 'umd-container-size');
    expect(s?.evidence).toBe('published');
    expect(s?.url).toMatch(/^https:\/\/extension\.umd\.edu\//);
  });

  // [crop, UMD group as printed, lower end of the printed depth in inches]. The page prints
  // "depth of 12-16 inches" (large), "8-12 inches" (medium) and "4-6 inches" (small).
  const umd: [string, string, number][] = [
    ['beet', 'Medium Vegetables', 8], ['chard', 'Medium Vegetables', 8], ['spinach', 'Small Vegetables', 4],
    ['carrot', 'Medium Vegetables', 8], ['lettuce', 'Small Vegetables', 4], ['cabbage', 'Medium Vegetables', 8],
    ['broccoli', 'Medium Vegetables', 8], ['kale', 'Medium Vegetables', 8], ['tomato', 'Large Vegetables', 12],
    ['sweet-pepper', 'Large Vegetables', 12], ['eggplant', 'Large Vegetables', 12], ['cucumber', 'Large Vegetables', 12],
    ['zucchini', 'Medium Vegetables', 8], ['winter-squash', 'Large Vegetables', 12], ['bush-bean', 'Medium Vegetables', 8],
    ['pea', 'Small Vegetables', 4], ['garlic', 'Small Vegetables', 4], ['basil', 'Small Vegetables', 4],
    ['parsley', 'Medium Vegetables', 8], ['coriander', 'Small Vegetables', 4],
  ];
  it.each(umd)('UMD container depth: %s, group %s, %s in, is the printed inches × 2.54 to the whole cm', (slug, group, inches) => {
    const d = crop(slug).minSoilDepthCm!;
    expect(d.value.container).toBe(in2wholeCm(inches));
    expect(d.note).toContain('umd-container-size');
    expect(d.note).toContain(group);
    expect(d.note).toContain(`lower end ${inches} in kept`);
    // The raised bed figure has no stored source, so the value as a whole is marked from memory.
    expect(d.source).toBe('from-memory');
    expect(d.note).toMatch(/raised bed from memory/);
  });

  it('cites the UMD page only for the crops in the table above, each note printing the group’s inches', () => {
    const cited = crops.filter((c) => c.minSoilDepthCm?.note?.includes('umd-container-size')).map((c) => c.slug);
    expect(cited.sort()).toEqual(umd.map(([slug]) => slug).sort());
    for (const slug of cited) {
      const note = crop(slug).minSoilDepthCm!.note!;
      const printed = /depth of (\d+)-(\d+) inches/.exec(note);
      expect(printed, slug).not.toBeNull();
      expect(crop(slug).minSoilDepthCm!.value.container, slug).toBe(in2wholeCm(Number(printed![1])));
    }
  });

  it('is a different thing from the FAO-56 rooting depth: the container figure stays below it', () => {
    for (const c of crops) {
      if (c.rootingDepthCm.source !== 'fao56-table22') continue;
      expect(c.minSoilDepthCm!.value.container, c.slug).toBeLessThan(c.rootingDepthCm.value.min);
    }
  });
});

describe('radish facts (common practice)', () => {
  const radish = crop('radish');
  it('emerges in 5–10 days, wants pH 6.0–7.0, sits 0.6–1.3 cm deep, sown 1 in apart and thinned to about 2 in', () => {
    expect(radish.daysToEmergence).toMatchObject({ value: { min: 5, max: 10 }, source: 'common-practice' });
    expect(radish.soilPh).toMatchObject({ value: { min: 6.0, max: 7.0 }, source: 'common-practice' });
    expect(radish.sowingDepthCm.value.min).toBeCloseTo(in2cm(0.25), 6);
    expect(radish.sowingDepthCm.value.max).toBeCloseTo(in2cm(0.5), 6);
    expect(radish.inRowCm.value.min).toBeCloseTo(in2cm(1), 6);
    expect(radish.inRowCm.value.max).toBeCloseTo(in2cm(2), 6);
    expect(radish.inRowCm.source).toBe('common-practice');
  });
  it('is side-dressed 3–4 weeks after emergence, needs 10 cm (container) to 20 cm (raised bed) of soil, keeps about 28 days at 0 °C', () => {
    expect(radish.sideDressing.value).toEqual({ needed: true, weeksAfterEmergence: { min: 3, max: 4 } });
    expect(radish.rootingDepthCm.value).toEqual({ min: 10, max: 20 });
    expect(radish.storage.value.temperatureC).toEqual({ min: 0, max: 0 });
    expect(radish.storage.value.days).toEqual({ min: 28, max: 28 });
    expect(radish.storage.value.humidityPct.min).toBeGreaterThanOrEqual(90);
  });
  it('says in its guidance that it comes up best at 13–24 °C and is harvested at 25–45 days', () => {
    expect(radish.guidance.sowing).toMatch(/13–24 °C/);
    expect(radish.guidance.pests).toMatch(/25–45 days/);
  });
});

describe('rotation', () => {
  it('defaults to 3 years, sourced to WVU', () => {
    expect(defaultRotationGapYears).toBe(3);
    expect(defaultRotationGap).toMatchObject({ value: 3, source: 'wvu-rotation' });
  });

  const rules: [string, number][] = [
    ['clubroot', 7], ['verticillium-wilt', 4], ['blackleg', 4], ['black-rot', 3], ['cercospora-leaf-spot', 3],
    ['bottom-rot-drop', 3], ['bean-anthracnose', 2], ['bean-bacterial-blight', 2], ['cucumber-scab', 2], ['cucumber-leaf-spot', 2],
  ];
  it.each(rules)('UConn IPM: %s keeps its hosts out for %s years', (disease, years) => {
    const rule = diseaseRotationRules.find((r) => r.disease === disease);
    expect(rule?.years).toMatchObject({ value: years, source: 'uconn-disease-rotation' });
  });

  it('names only soil-borne diseases, and families or crops that exist in the catalogue', () => {
    const families = new Set(crops.map((c) => c.family.value));
    for (const rule of diseaseRotationRules) {
      expect(pestBySlug(rule.disease)?.soilBorne, rule.disease).toBe(true);
      expect(rule.families.length + (rule.crops?.length ?? 0), rule.disease).toBeGreaterThan(0);
      for (const f of rule.families) expect(families.has(f), f).toBe(true);
      // Strawberry is named by UConn but not yet a catalogue crop.
      for (const c of rule.crops ?? []) if (c !== 'strawberry') expect(cropBySlug(c), c).toBeDefined();
    }
  });

  it('covers radish and turnip under clubroot and says liming suppresses it without clearing the soil', () => {
    const clubroot = diseaseRotationRules.find((r) => r.disease === 'clubroot')!;
    expect(clubroot.families).toContain(crop('radish').family.value);
    expect(clubroot.families).toContain(crop('turnip').family.value);
    expect(clubroot.suppression?.source).toBe('clubroot-liming');
    expect(clubroot.suppression?.value).toMatch(/7\.2/);
    expect(clubroot.suppression?.value).toMatch(/does not kill/);
  });

  it('keeps strawberry and every Solanaceae crop out after Verticillium', () => {
    const v = diseaseRotationRules.find((r) => r.disease === 'verticillium-wilt')!;
    expect(v.crops).toContain('strawberry');
    for (const slug of ['tomato', 'potato', 'sweet-pepper', 'eggplant']) expect(v.families).toContain(crop(slug).family.value);
  });
});

describe('relations', () => {
  const researchPairs = new Set(['potato|tomato', 'french-marigold|tomato', 'carrot|french-marigold', 'winter-squash|zucchini', 'basil|tomato']);
  const key = (a: string, b: string) => [a, b].sort().join('|');

  it('has at least 40 pairs between existing crops, each with a listed source and no duplicate pair', () => {
    expect(cropRelations.length).toBeGreaterThanOrEqual(40);
    const seen = new Set<string>();
    for (const r of cropRelations) {
      const k = key(r.a, r.b);
      expect(cropBySlug(r.a), k).toBeDefined();
      expect(cropBySlug(r.b), k).toBeDefined();
      expect(r.a, k).not.toBe(r.b);
      expect(sourceIds.has(r.source), k).toBe(true);
      expect(r.reason.length, k).toBeGreaterThan(20);
      if (r.scope.kind === 'neighbours') expect(r.scope.distanceM, k).toBeGreaterThan(0);
      expect(seen.has(k), `duplicate ${k}`).toBe(false);
      seen.add(k);
    }
  });

  it('marks research only for the research-backed pairs, on a published source; the rest rest on common practice', () => {
    for (const r of cropRelations) {
      const k = key(r.a, r.b);
      if (r.evidence === 'research') {
        expect(researchPairs.has(k), k).toBe(true);
        expect(cropSources.find((s) => s.id === r.source)?.evidence, k).toBe('published');
      } else {
        expect(r.source, k).toBe('common-practice');
        expect(r.severity ?? 'watch', k).toBe('watch');
      }
    }
  });

  it('shows that most companion claims are folk practice, with the WSU caution', () => {
    const folk = cropRelations.filter((r) => r.evidence === 'common_practice').length;
    expect(folk / cropRelations.length).toBeGreaterThan(0.8);
    expect(companionCaution.source).toBe('chalker-scott-wsu');
  });

  it('keeps tomato and potato apart across neighbouring plots as a clash over late blight and Verticillium', () => {
    const r = cropRelations.find((x) => key(x.a, x.b) === 'potato|tomato');
    expect(r).toMatchObject({ effect: 'antagonistic', evidence: 'research', severity: 'clash', scope: { kind: 'neighbours', distanceM: 1.5 } });
    expect(r?.reason).toMatch(/late blight/i);
    expect(r?.reason).toMatch(/Verticillium/);
  });
});
