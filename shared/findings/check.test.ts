import { describe, expect, it } from 'vitest';
import { crops } from '../crops/crops';
import { cropRelations } from '../crops/relations';
import { diseaseRotationRules } from '../crops/rotation';
import { affectedPlots, checkDraft, checkPlots, SHADE_MIN_REACH_M, withinGap } from './check';
import type { CheckContext, CheckObservation, CheckPlanting, CheckPlot, CheckRelation, Finding } from './types';
import { noonElevationDeg, shadowLengthM } from './sun';
import { whatFits } from './what-fits';

// The neighbour check against facts of the trade. Each external value names its source beside it;
// positions and dates are made up for the test.

const idOf = new Map(crops.map((c, i) => [c.slug, i + 1]));
const id = (slug: string) => {
  const v = idOf.get(slug);
  if (!v) throw new Error(`no crop ${slug}`);
  return v;
};
const relations: CheckRelation[] = cropRelations.map((r) => ({
  cropA: id(r.a),
  cropB: id(r.b),
  effect: r.effect,
  distanceM: r.scope.kind === 'neighbours' ? r.scope.distanceM : null,
  severity: r.severity ?? null,
  reason: r.reason,
  evidence: r.evidence,
  source: r.source,
}));

/** A 3 m × 5 m plot at (x, y). Map north is up: a smaller y is further north. */
function plot(pid: number, x: number, y: number, extra: Partial<CheckPlot> = {}): CheckPlot {
  return { id: pid, label: `P${pid}`, x, y, width: 3, length: 5, rotation: 0, kind: 'in_ground', soilDepthM: null, soilPh: null, ...extra };
}

let nextId = 100;
function planting(plotId: number, slug: string, seasonYear: number, plantedOn: string, extra: Partial<CheckPlanting> = {}): CheckPlanting {
  return { id: nextId++, plotId, seasonYear, cropId: id(slug), part: null, method: 'sown', plantedOn, status: 'sown', ...extra };
}

function context(plots: CheckPlot[], plantings: CheckPlanting[], extra: Partial<CheckContext> = {}): CheckContext {
  return {
    site: { id: 1, latitude: 51.5, pathWidthM: 0.9, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null },
    plots,
    plantings,
    observations: [],
    crops: new Map(crops.map((c) => [id(c.slug), { id: id(c.slug), data: c }])),
    relations,
    rotationGapYears: 3,
    diseaseRules: diseaseRotationRules,
    ...extra,
  };
}

const about = (findings: Finding[], plantingId: number) => findings.filter((f) => f.plantingId === plantingId);
const rules = (findings: Finding[]) => findings.map((f) => f.rule).sort();

describe('rotation by family', () => {
  // Tomato and potato are both Solanaceae (shared/crops: Virginia Tech, Family: Solanaceae).
  it('is a clash when the same family grew in the same plot within the gap, naming the earlier planting and season', () => {
    const potato = planting(1, 'potato', 2025, '2025-04-15');
    const tomato = planting(1, 'tomato', 2026, '2026-05-20', { method: 'transplanted' });
    const found = about(checkPlots(context([plot(1, 0, 0)], [potato, tomato])), tomato.id).filter((f) => f.kind === 'rotation');
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ severity: 'clash', rule: 'rotation_family', peers: [{ plantingId: potato.id, seasonYear: 2025 }] });
    expect(found[0].message).toBe(
      "Tomato (Solanaceae) here follows potato (Solanaceae) from 2025: the club's gap for the same family is 3 years, so Solanaceae is due back in this soil from 2028.",
    );
    // WVU Extension: rotate families over 2–3 years (the club's gap of 3 is the upper end).
    expect(found[0].source.id).toBe('wvu-rotation');
  });

  it('defines the boundary once: season N + gap is allowed, N + gap − 1 is not', () => {
    expect(withinGap(2025, 2027, 3)).toBe(true);
    expect(withinGap(2025, 2028, 3)).toBe(false);
    const potato = planting(1, 'potato', 2025, '2025-04-15');
    const at2027 = planting(1, 'tomato', 2027, '2027-05-20', { method: 'transplanted' });
    const at2028 = planting(1, 'tomato', 2028, '2028-05-20', { method: 'transplanted' });
    const f = checkPlots(context([plot(1, 0, 0)], [potato, at2027, at2028]));
    expect(rules(about(f, at2027.id))).toContain('rotation_family');
    // 2028 follows 2027's tomato (1 year) — so measure 2028 against the potato alone.
    const alone = checkPlots(context([plot(1, 0, 0)], [potato, at2028]));
    expect(rules(about(alone, at2028.id))).not.toContain('rotation_family');
  });

  it('follows the club setting for the gap', () => {
    const potato = planting(1, 'potato', 2024, '2024-04-15');
    const tomato = planting(1, 'tomato', 2027, '2027-05-20', { method: 'transplanted' });
    expect(rules(about(checkPlots(context([plot(1, 0, 0)], [potato, tomato])), tomato.id))).not.toContain('rotation_family');
    const four = checkPlots(context([plot(1, 0, 0)], [potato, tomato], { rotationGapYears: 4 }));
    expect(about(four, tomato.id).find((f) => f.rule === 'rotation_family')?.numbers).toMatchObject({ gapYears: 4, backFrom: 2028 });
  });

  it('is not a clash for a different family, or another plot', () => {
    const potato = planting(1, 'potato', 2025, '2025-04-15');
    const beanHere = planting(1, 'bush-bean', 2026, '2026-05-20');
    const tomatoNextDoor = planting(2, 'tomato', 2026, '2026-05-20', { method: 'transplanted' });
    const f = checkPlots(context([plot(1, 0, 0), plot(2, 10, 0)], [potato, beanHere, tomatoNextDoor]));
    expect(rules(about(f, beanHere.id))).not.toContain('rotation_family');
    expect(rules(about(f, tomatoNextDoor.id))).not.toContain('rotation_family');
  });

  it('with parts of a plot, clashes only where the rectangles overlap', () => {
    const potato = planting(1, 'potato', 2025, '2025-04-15', { part: { x: 0, y: 0, width: 3, length: 2 } });
    const apart = planting(1, 'tomato', 2026, '2026-05-20', { method: 'transplanted', part: { x: 0, y: 2, width: 3, length: 3 } });
    const over = planting(1, 'sweet-pepper', 2026, '2026-05-20', { method: 'transplanted', part: { x: 1, y: 1.5, width: 1, length: 1 } });
    const whole = planting(1, 'eggplant', 2026, '2026-05-20', { method: 'transplanted' });
    const f = checkPlots(context([plot(1, 0, 0)], [potato, apart, over, whole]));
    expect(rules(about(f, apart.id))).not.toContain('rotation_family');
    expect(rules(about(f, over.id))).toContain('rotation_family');
    expect(rules(about(f, whole.id))).toContain('rotation_family');
  });
});

describe('rotation after a soil-borne disease', () => {
  // UConn IPM, rotation periods for vegetable diseases: "clubroot 7 years (avoid turnip and radish too)".
  const clubroot = (plotId: number, observedOn: string, extra: Partial<CheckObservation> = {}): CheckObservation => ({
    id: 900, plotId, plantingId: null, pestSlug: 'clubroot', name: 'Clubroot', isSoilBorne: true, part: null, observedOn, ...extra,
  });

  it('extends the gap to 7 years for the whole cabbage family, radish and turnip included', () => {
    const radish = planting(1, 'radish', 2029, '2029-04-01');
    const turnip = planting(1, 'turnip', 2030, '2030-04-01');
    const after = planting(1, 'radish', 2031, '2031-04-01');
    const f = checkPlots(context([plot(1, 0, 0)], [radish], { observations: [clubroot(1, '2024-07-10')] }));
    const hit = about(f, radish.id).find((x) => x.rule === 'rotation_disease');
    expect(hit).toMatchObject({ severity: 'clash', kind: 'rotation', numbers: { gapYears: 7, seenYear: 2024, backFrom: 2031 } });
    expect(hit?.message).toContain('Keep the whole Brassicaceae family out of it for 7 years, until 2031');
    expect(hit?.source.id).toBe('uconn-disease-rotation');
    const t = checkPlots(context([plot(1, 0, 0)], [turnip], { observations: [clubroot(1, '2024-07-10')] }));
    expect(rules(about(t, turnip.id))).toContain('rotation_disease');
    const a = checkPlots(context([plot(1, 0, 0)], [after], { observations: [clubroot(1, '2024-07-10')] }));
    expect(rules(about(a, after.id))).not.toContain('rotation_disease');
  });

  it('leaves other families and other plots alone, and a non-overlapping part', () => {
    const carrot = planting(1, 'carrot', 2026, '2026-04-01');
    const radishNext = planting(2, 'radish', 2026, '2026-04-01');
    const radishApart = planting(1, 'radish', 2026, '2026-04-01', { part: { x: 0, y: 3, width: 3, length: 2 } });
    const obs = [clubroot(1, '2025-07-10', { part: { x: 0, y: 0, width: 3, length: 2 } })];
    const f = checkPlots(context([plot(1, 0, 0), plot(2, 10, 0)], [carrot, radishNext, radishApart], { observations: obs }));
    for (const p of [carrot, radishNext, radishApart]) expect(rules(about(f, p.id))).not.toContain('rotation_disease');
  });
});

describe('companions', () => {
  // Radish does well beside peas, beans, lettuce, spinach, carrots and squash, and badly beside potatoes: common practice.
  it.each(['pea', 'bush-bean', 'lettuce', 'spinach', 'carrot', 'winter-squash', 'zucchini'])('radish with %s in the same plot is a good pairing (common practice)', (other) => {
    const radish = planting(1, 'radish', 2026, '2026-05-01');
    const mate = planting(1, other, 2026, '2026-05-01');
    const f = about(checkPlots(context([plot(1, 0, 0)], [radish, mate])), radish.id).filter((x) => x.kind === 'companion');
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'good', rule: 'companion_help', source: { evidence: 'common_practice' } });
    expect(f[0].message).toContain('(common practice)');
  });

  it('radish beside potato in the same plot is a watch, not a clash (common practice)', () => {
    const radish = planting(1, 'radish', 2026, '2026-05-01');
    const potato = planting(1, 'potato', 2026, '2026-04-20');
    const f = about(checkPlots(context([plot(1, 0, 0)], [radish, potato])), radish.id).filter((x) => x.kind === 'companion');
    expect(f).toMatchObject([{ severity: 'watch', rule: 'companion_harm' }]);
  });

  it('crosses a path no wider than the site path, within the relation distance, but never two plots away', () => {
    // Plot 2 is 0.9 m south of plot 1 (a path), plot 3 another 0.9 m further south.
    const plots = [plot(1, 0, 0), plot(2, 0, 5.9), plot(3, 0, 11.8)];
    const radish = planting(1, 'radish', 2026, '2026-05-01');
    const potatoNext = planting(2, 'potato', 2026, '2026-04-20');
    const potatoFar = planting(3, 'potato', 2026, '2026-04-20');
    const f = about(checkPlots(context(plots, [radish, potatoNext, potatoFar])), radish.id).filter((x) => x.kind === 'companion');
    expect(f).toHaveLength(1);
    expect(f[0].peers[0].plantingId).toBe(potatoNext.id);
    expect(f[0].numbers).toEqual({ distanceM: 0.9, withinM: 1 });
    // Across a path wider than the site's: not neighbours.
    const wide = about(checkPlots(context([plot(1, 0, 0), plot(2, 0, 6.2)], [radish, { ...potatoNext }])), radish.id);
    expect(wide.filter((x) => x.kind === 'companion')).toHaveLength(0);
  });

  it('a same-plot relation does not reach across a path', () => {
    const radish = planting(1, 'radish', 2026, '2026-05-01');
    const peas = planting(2, 'pea', 2026, '2026-05-01');
    const f = about(checkPlots(context([plot(1, 0, 0), plot(2, 3, 0)], [radish, peas])), radish.id);
    expect(f.filter((x) => x.kind === 'companion')).toHaveLength(0);
  });

  it('shows the research evidence level and the clash where the source says the harm is real', () => {
    // Tomato and potato share late blight: research-backed, a clash (extension sources in shared/crops/sources.ts).
    const tomato = planting(1, 'tomato', 2026, '2026-05-20', { method: 'transplanted' });
    const potato = planting(2, 'potato', 2026, '2026-04-20');
    const f = about(checkPlots(context([plot(1, 0, 0), plot(2, 3.9, 0)], [tomato, potato])), tomato.id).filter((x) => x.kind === 'companion');
    expect(f).toMatchObject([{ severity: 'clash', source: { evidence: 'research' } }]);
    expect(f[0].message).toContain('(research, within 1.5 m)');
  });

  it('ignores plantings that are not in the ground at the same time', () => {
    const radish = planting(1, 'radish', 2026, '2026-03-20');
    const latePotato = planting(1, 'potato', 2026, '2026-08-01');
    const f = about(checkPlots(context([plot(1, 0, 0)], [radish, latePotato])), radish.id);
    expect(f.filter((x) => x.kind === 'companion')).toHaveLength(0);
  });
});

describe('shade', () => {
  // Sunflower: mature height 2 m in the crop notes. NOAA Solar Calculator: at 51.5° N the noon sun
  // stands 61.94° high on 2024-06-20, so a 2 m plant casts 2 / tan(61.94°) = 1.07 m (computed).
  const tallSouth = (northY: number) => [plot(1, 0, 0), plot(2, 0, northY)];

  it('a tall crop’s noon shadow reaching a sun-loving crop in the plot to its north is a watch, with the numbers', () => {
    // Plot 1 (north) ends at y = 5; plot 2 begins across a 0.9 m path.
    const beans = planting(1, 'bush-bean', 2024, '2024-06-20');
    const sunflower = planting(2, 'sunflower', 2024, '2024-04-20');
    const f = about(checkPlots(context(tallSouth(5.9), [beans, sunflower])), beans.id).filter((x) => x.kind === 'shade');
    expect(f).toHaveLength(1);
    expect(f[0].numbers.distanceM).toBe(0.9);
    expect(f[0].numbers.shadowM).toBeGreaterThan(0.9);
    expect(f[0].message).toMatch(/casts a noon shadow of [\d.]+ m on 2024-/);
  });

  it('a shadow that reaches across a 0.9 m path does not reach across 1.2 m (radish sown 2024-06-20)', () => {
    // Radish (30 cm, full sun) sown on 20 June is in the ground about a month: its key dates are
    // 20 June (2 / tan 61.94° = 1.07 m, NOAA elevation, computed) and early July (sun a little lower).
    const radish = planting(1, 'radish', 2024, '2024-06-20');
    const sunflower = planting(2, 'sunflower', 2024, '2024-04-01');
    const near = about(checkPlots(context(tallSouth(5.9), [radish, sunflower])), radish.id).find((x) => x.kind === 'shade');
    expect(near?.numbers.distanceM).toBe(0.9);
    const date = /on (\d{4}-\d{2}-\d{2})/.exec(near!.message)![1];
    expect(near!.numbers.shadowM).toBeCloseTo(shadowLengthM(2, noonElevationDeg(date, 51.5)), 2);
    expect(near!.numbers.shadowM).toBeGreaterThanOrEqual(1.07);
    expect(near!.numbers.shadowM).toBeLessThan(1.2);
    const site = { id: 1, latitude: 51.5, pathWidthM: 1.3, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };
    const far = about(checkPlots(context(tallSouth(6.2), [radish, sunflower], { site })), radish.id);
    expect(far.filter((x) => x.kind === 'shade')).toHaveLength(0);
  });

  it('leaves out a shadow that only grazes the edge (under 10 cm in, our own threshold)', () => {
    // 1.07 m of shadow across a 1.0 m gap reaches 7 cm in (on 2024-06-20; mid-season is later and lower, so sow a
    // quick crop and check only dates with a short shadow): the path is 1.0 m and the site allows it.
    const site = { id: 1, latitude: 51.5, pathWidthM: 1.0, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };
    const radish = planting(1, 'radish', 2024, '2024-06-10');
    const sunflower = planting(2, 'sunflower', 2024, '2024-04-01');
    const f = about(checkPlots(context(tallSouth(6.0), [radish, sunflower], { site })), radish.id).filter((x) => x.kind === 'shade');
    // Both key dates (10 June, early July) have the sun near 61°: about 1.09 m of shadow, 9 cm past the 1.0 m gap.
    expect(shadowLengthM(2, noonElevationDeg('2024-06-10', 51.5)) - 1.0).toBeLessThan(SHADE_MIN_REACH_M);
    expect(f).toHaveLength(0);
    // Across 0.9 m the same shadow reaches 19 cm in, and counts.
    const near = about(checkPlots(context(tallSouth(5.9), [radish, sunflower], { site })), radish.id).filter((x) => x.kind === 'shade');
    expect(near).toHaveLength(1);
  });

  it('counts the tall crop only once it stands at full height', () => {
    // Sweet corn (1.5 m) has FAO-56 Table 11 stages of 20 + 25 days before mid-season: sown on 2024-06-01 it
    // stands full height from 2024-07-16. Radish sown on 2024-05-20 is out by 2024-07-09 (50 days at most).
    const radish = planting(1, 'radish', 2024, '2024-05-20');
    const young = planting(2, 'sweet-corn', 2024, '2024-06-01');
    expect(about(checkPlots(context(tallSouth(5.9), [radish, young])), radish.id).filter((x) => x.kind === 'shade')).toHaveLength(0);
    // The same corn sown in April stands full height by late May, while the radish grows: a shadow of
    // 1.5 / tan(~60°) ≈ 0.9 m does not cross 0.9 m plus 10 cm, so put the radish across a narrow 0.5 m path.
    const early = planting(2, 'sweet-corn', 2024, '2024-04-01');
    const site = { id: 1, latitude: 51.5, pathWidthM: 0.5, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };
    const shaded = about(checkPlots(context(tallSouth(5.5), [radish, early], { site })), radish.id).filter((x) => x.kind === 'shade');
    expect(shaded).toHaveLength(1);
    expect(shaded[0].numbers.heightM).toBe(1.5);
  });

  it('never falls south in the northern hemisphere', () => {
    const beans = planting(2, 'bush-bean', 2024, '2024-06-20');
    const sunflower = planting(1, 'sunflower', 2024, '2024-04-20');
    const f = about(checkPlots(context(tallSouth(5.9), [beans, sunflower])), beans.id);
    expect(f.filter((x) => x.kind === 'shade')).toHaveLength(0);
  });

  it('falls south in the southern hemisphere', () => {
    const south = { id: 1, latitude: -33.9, pathWidthM: 0.9, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };
    // Winter at 33.9° S (June): the noon sun is low in the north, so the sunflower to the north shades the beans south of it.
    const beans = planting(2, 'bush-bean', 2024, '2024-06-20');
    const sunflower = planting(1, 'sunflower', 2024, '2024-04-20');
    const f = about(checkPlots(context(tallSouth(5.9), [beans, sunflower], { site: south })), beans.id).filter((x) => x.kind === 'shade');
    expect(f).toHaveLength(1);
    expect(f[0].message).toContain('to its south');
  });

  it('is not checked for a crop that does not need full sun', () => {
    const lettuce = planting(1, 'lettuce', 2024, '2024-06-20');
    const sunflower = planting(2, 'sunflower', 2024, '2024-04-20');
    expect(about(checkPlots(context(tallSouth(5.9), [lettuce, sunflower])), lettuce.id).filter((x) => x.kind === 'shade')).toHaveLength(0);
  });
});

describe('site fit', () => {
  it('soil pH outside the crop’s range is a watch', () => {
    const potato = planting(1, 'potato', 2026, '2026-04-20');
    const f = about(checkPlots(context([plot(1, 0, 0, { soilPh: 7.4 })], [potato])), potato.id).find((x) => x.rule === 'soil_ph');
    expect(f).toMatchObject({ severity: 'watch', kind: 'site_fit', numbers: { soilPh: 7.4 } });
    const ok = about(checkPlots(context([plot(1, 0, 0, { soilPh: 6 })], [potato])), potato.id);
    expect(rules(ok)).not.toContain('soil_ph');
  });

  it('radish needs at least 8 inches of soil in a raised bed and 4 inches in a container (common practice)', () => {
    const radish = (plotId: number) => planting(plotId, 'radish', 2026, '2026-04-20');
    const cases: Array<[CheckPlot['kind'], number, boolean]> = [
      ['raised_bed', 0.15, true],
      ['raised_bed', 0.2, false],
      ['container', 0.08, true],
      ['container', 0.1, false],
      ['in_ground', 0.05, false],
    ];
    for (const [kind, depth, shallow] of cases) {
      const p = radish(1);
      const f = about(checkPlots(context([plot(1, 0, 0, { kind, soilDepthM: depth })], [p])), p.id);
      expect(rules(f).includes('soil_depth'), `${kind} ${depth} m`).toBe(shallow);
    }
  });

  it('a tender crop sown before the site’s last spring frost is a watch; after it, none', () => {
    const frosty = { id: 1, latitude: 51.5, pathWidthM: 0.9, lastSpringFrost: '05-10', firstAutumnFrost: '10-20', soilTempsC: null };
    const early = planting(1, 'bush-bean', 2026, '2026-05-09');
    const late = planting(1, 'bush-bean', 2026, '2026-05-11');
    const f = checkPlots(context([plot(1, 0, 0)], [early], { site: frosty }));
    expect(about(f, early.id).find((x) => x.rule === 'frost')?.message).toContain('1 days before');
    const g = checkPlots(context([plot(1, 0, 0)], [late], { site: frosty }));
    expect(rules(about(g, late.id))).not.toContain('frost');
  });

  it('soil below the crop’s germination minimum on the sowing date is a watch', () => {
    // Bush bean seed needs about 16 °C soil (OSU germination table in the crop notes, printed as 60 °F).
    const temps = [2, 3, 6, 9, 12, 15, 17, 17, 14, 10, 6, 3];
    const site = { id: 1, latitude: 51.5, pathWidthM: 0.9, lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: temps };
    const may = planting(1, 'bush-bean', 2026, '2026-05-20');
    const july = planting(1, 'bush-bean', 2026, '2026-07-01');
    const f = checkPlots(context([plot(1, 0, 0)], [may, july], { site }));
    expect(about(f, may.id).find((x) => x.rule === 'soil_temperature')?.numbers).toMatchObject({ soilC: 12 });
    expect(rules(about(f, july.id))).not.toContain('soil_temperature');
    const transplanted = planting(1, 'tomato', 2026, '2026-05-20', { method: 'transplanted' });
    expect(rules(about(checkPlots(context([plot(1, 0, 0)], [transplanted], { site })), transplanted.id))).not.toContain('soil_temperature');
  });
});

describe('drafts, what fits and affected plots', () => {
  it('a draft gives the findings the saved planting gets', () => {
    const potato = planting(1, 'potato', 2025, '2025-04-15');
    const saved = planting(1, 'tomato', 2026, '2026-05-20', { method: 'transplanted' });
    const ctx = context([plot(1, 0, 0), plot(2, 3, 0)], [potato, saved]);
    const stored = about(checkPlots(ctx), saved.id);
    const draft = checkDraft(context([plot(1, 0, 0), plot(2, 3, 0)], [potato]), { ...saved, id: 0 });
    expect(draft.map((f) => ({ ...f, plantingId: saved.id }))).toEqual(stored);
  });

  it('ranks good choices first and clashes last, with the reasons', () => {
    const potato = planting(1, 'potato', 2025, '2025-04-15');
    const peas = planting(1, 'pea', 2026, '2026-04-01');
    const ranked = whatFits(context([plot(1, 0, 0)], [potato, peas]), { plotId: 1, seasonYear: 2026, part: null, date: '2026-04-10' });
    expect(ranked).toHaveLength(crops.length);
    const order = ranked.map((r) => r.verdict);
    const rank = { good: 0, fine: 1, watch: 2, clash: 3 };
    for (let i = 1; i < order.length; i++) expect(rank[order[i]]).toBeGreaterThanOrEqual(rank[order[i - 1]]);
    const radish = ranked.find((r) => r.cropId === id('radish'))!;
    expect(radish.verdict).toBe('good');
    const tomato = ranked.find((r) => r.cropId === id('tomato'))!;
    expect(tomato.verdict).toBe('clash');
    expect(tomato.findings.map((f) => f.rule)).toContain('rotation_family');
  });

  it('a change on a plot affects the plot and its neighbours only', () => {
    const plots = [plot(1, 0, 0), plot(2, 3, 0), plot(3, 6.9, 0), plot(4, 20, 0)];
    expect([...affectedPlots(context(plots, []), [2])].sort()).toEqual([1, 2, 3]);
  });
});

describe('a club’s own crop with only the values its form requires', () => {
  // CropCreateBodySchema requires names, family, kind, sowing and days to maturity; every other value may be left out.
  const clubBean = {
    slug: 'club-bean',
    commonName: 'Club bean',
    botanicalName: { value: 'Vicia faba', source: 'from-memory' },
    family: { value: 'Fabaceae', source: 'from-memory' },
    kind: 'legume',
    sowing: { value: 'direct', source: 'from-memory' },
    daysToMaturity: { value: { min: 80, max: 100, from: 'sowing' }, source: 'from-memory' },
    watchFor: [],
    guidance: {},
  } as unknown as (typeof crops)[number];
  const clubId = crops.length + 1;

  it('is tried by what fits and checked as a draft beside a related crop, leaving out the rules its missing values need', () => {
    const sown = planting(1, 'radish', 2026, '2026-04-01');
    // A sunflower in the plot to the south would shade a sun-loving crop; the club bean's sun need is not known.
    const ctx = context([plot(1, 0, 0, { soilPh: 4.5 }), plot(2, 0, 5.9)], [sown, planting(2, 'sunflower', 2026, '2026-04-01')], {
      crops: new Map([...crops.map((c) => [id(c.slug), { id: id(c.slug), data: c }] as const), [clubId, { id: clubId, data: clubBean }]]),
      // A club relation between the club crop and radish in the same plot: companions need both plantings' dates.
      relations: [...relations, { cropA: clubId, cropB: id('radish'), effect: 'beneficial', distanceM: null, severity: null, reason: 'Club pair', evidence: 'common_practice', source: 'common-practice' }],
      site: { id: 1, latitude: 51.5, pathWidthM: 0.9, lastSpringFrost: '04-25', firstAutumnFrost: '10-15', soilTempsC: [2, 3, 5, 8, 12, 15, 17, 17, 14, 10, 6, 3] },
    });
    const ranked = whatFits(ctx, { plotId: 1, seasonYear: 2026, part: null, date: '2026-04-10' });
    expect(ranked.map((r) => r.cropId)).toContain(clubId);
    const draft = checkDraft(ctx, { ...planting(1, 'radish', 2026, '2026-04-10'), cropId: clubId, id: 0 });
    // Nothing is claimed without the values: pH, shade, frost and soil temperature have none, and the
    // companion rule needs the planting's dates, which plantingDates gives only with germination and emergence values.
    expect(rules(draft)).toEqual([]);
    expect(ranked.find((r) => r.cropId === clubId)!.verdict).toBe('fine');
  });
});
