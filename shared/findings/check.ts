import { neighbours, type Bounds } from '../geometry';
import type { Crop, DiseaseRotationRule } from '../crops/types';
import { daysBetween, plantingDates, plusDays } from '../plot-book/dates';
import { boxGap, eastWestOverlap, partsOverlap, plantingFootprint } from './footprint';
import { findingSource } from './sources';
import { noonElevationDeg, noonSunDirection, shadowLengthM } from './sun';
import type { CheckContext, CheckPlanting, CheckPlot, CheckRelation, Finding, FindingPeer } from './types';

// The neighbour check: rotation, companions, shade and site fit for each planting, from the site's
// plots, every season's plantings and the soil-borne observations. Pure: the same context gives the
// same findings in the same order, which is what lets the server store them and compare.

/**
 * The rotation boundary, used by the family gap and the disease gaps alike: a family grown in season
 * N may come back to the same soil in season N + gap, not before. With the club's gap of 3 years,
 * potato in 2025 makes tomato a clash in 2026 and 2027, and tomato in 2028 is fine.
 * `laterYear - earlierYear < gap` is a clash; `>= gap` is allowed. The same season is not a rotation.
 */
export function withinGap(earlierYear: number, laterYear: number, gapYears: number): boolean {
  const apart = laterYear - earlierYear;
  return apart >= 0 && apart < gapYears;
}

/** A crop this tall (mature height, cm) or taller is checked for the shade it casts: our own threshold (common practice calls such crops "tall"). */
export const TALL_CROP_CM = 100;

/** A noon shadow must reach this far into a planting to count (our own threshold: a shadow that only grazes the edge is left out). */
export const SHADE_MIN_REACH_M = 0.1;

/** Plantings whose growing time overlaps by fewer days than this are not together in the ground. */
const MIN_DAYS_TOGETHER = 1;

interface Prepared {
  ctx: CheckContext;
  plots: Map<number, CheckPlot>;
  /** Neighbouring plots of each plot, with the path between them. */
  neighbours: Map<number, Array<{ plotId: number; gap: number }>>;
  bySeasonPlot: Map<string, CheckPlanting[]>;
  byPlot: Map<number, CheckPlanting[]>;
  soilBorne: Map<number, CheckContext['observations']>;
  relations: Map<string, CheckRelation>;
  /** Each planting's growing window, worked out once; weak, so drafts checked against a kept context leave with their request. */
  windows: WeakMap<CheckPlanting, { from: string; to: string }>;
}

const pairKey = (a: number, b: number) => (a < b ? `${a}|${b}` : `${b}|${a}`);
const spKey = (seasonYear: number, plotId: number) => `${seasonYear}|${plotId}`;

function push<K, V>(map: Map<K, V[]>, key: K, value: V) {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

/** Indexes a context once, so checking every planting of a site stays linear in its size. */
export function prepare(ctx: CheckContext): Prepared {
  const plots = new Map(ctx.plots.map((p) => [p.id, p]));
  const nb = new Map<number, Array<{ plotId: number; gap: number }>>();
  for (const n of neighbours(ctx.plots, ctx.site.pathWidthM, ctx.eps)) {
    push(nb, n.a, { plotId: n.b, gap: n.gap });
    push(nb, n.b, { plotId: n.a, gap: n.gap });
  }
  const bySeasonPlot = new Map<string, CheckPlanting[]>();
  const byPlot = new Map<number, CheckPlanting[]>();
  for (const p of ctx.plantings) {
    push(bySeasonPlot, spKey(p.seasonYear, p.plotId), p);
    push(byPlot, p.plotId, p);
  }
  const soilBorne = new Map<number, CheckContext['observations']>();
  for (const o of ctx.observations) if (o.isSoilBorne && o.pestSlug) push(soilBorne, o.plotId, o);
  const relations = new Map<string, CheckRelation>();
  for (const r of ctx.relations) relations.set(pairKey(r.cropA, r.cropB), r);
  return { ctx, plots, neighbours: nb, bySeasonPlot, byPlot, soilBorne, relations, windows: new WeakMap() };
}

function cropOf(pr: Prepared, planting: CheckPlanting): Crop | null {
  return pr.ctx.crops.get(planting.cropId)?.data ?? null;
}

/** From sowing or planting out to the end of the harvest window, from the crop notes. */
/**
 * A planting's dates, or null when its crop lacks a value they need: a club's own crop may have only the
 * values its form requires (CropCreateBodySchema), as the plot book allows (plantingDatesFor).
 */
function datesOf(input: Parameters<typeof plantingDates>[0]): ReturnType<typeof plantingDates> | null {
  try {
    return plantingDates(input);
  } catch {
    return null;
  }
}

function windowOf(pr: Prepared, planting: CheckPlanting): { from: string; to: string } | null {
  const cached = pr.windows.get(planting);
  if (cached) return cached;
  const crop = cropOf(pr, planting);
  if (!crop) return null;
  const dates = datesOf({ crop, method: planting.method, date: planting.plantedOn });
  if (!dates) return null;
  const w = { from: planting.plantedOn, to: dates.harvest.latest };
  pr.windows.set(planting, w);
  return w;
}

function together(pr: Prepared, a: CheckPlanting, b: CheckPlanting): boolean {
  const wa = windowOf(pr, a);
  const wb = windowOf(pr, b);
  if (!wa || !wb) return false;
  const from = wa.from > wb.from ? wa.from : wb.from;
  const to = wa.to < wb.to ? wa.to : wb.to;
  return from <= to && daysBetween(from, to) + 1 >= MIN_DAYS_TOGETHER;
}

function peerOf(pr: Prepared, p: CheckPlanting): FindingPeer {
  return {
    plantingId: p.id,
    plotId: p.plotId,
    plotLabel: pr.plots.get(p.plotId)?.label ?? '?',
    cropName: cropOf(pr, p)?.commonName ?? 'an unknown crop',
    seasonYear: p.seasonYear,
  };
}

const lower = (name: string) => name.toLowerCase();
const metres = (m: number) => `${m.toFixed(2).replace(/\.?0+$/, '')} m`;
const list = (words: string[]) => (words.length <= 1 ? words.join('') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`);

type Draft = Omit<Finding, 'plantingId' | 'plotId' | 'plotLabel' | 'cropName' | 'seasonYear'>;

function rotationFindings(pr: Prepared, s: CheckPlanting, crop: Crop): Draft[] {
  const out: Draft[] = [];
  const family = crop.family.value;
  const gap = pr.ctx.rotationGapYears;
  const earlier = (pr.byPlot.get(s.plotId) ?? [])
    .filter((e) => e.id !== s.id && e.seasonYear < s.seasonYear && withinGap(e.seasonYear, s.seasonYear, gap))
    .filter((e) => cropOf(pr, e)?.family.value === family && partsOverlap(e.part, s.part))
    .sort((a, b) => b.seasonYear - a.seasonYear || b.plantedOn.localeCompare(a.plantedOn) || a.id - b.id);
  if (earlier.length > 0) {
    const last = earlier[0];
    const lastCrop = cropOf(pr, last)!;
    const backFrom = last.seasonYear + gap;
    const others = earlier.slice(1).map((e) => `${lower(cropOf(pr, e)!.commonName)} (${e.seasonYear})`);
    out.push({
      key: 'rotation_family',
      severity: 'clash',
      kind: 'rotation',
      rule: 'rotation_family',
      title: `Same family within ${gap} years`,
      message:
        `${crop.commonName} (${family}) here follows ${lower(lastCrop.commonName)} (${family}) from ${last.seasonYear}` +
        `${others.length ? `, and ${list(others)}` : ''}: the club's gap for the same family is ${gap} years, so ${family} is due back in this soil from ${backFrom}.`,
      peers: earlier.map((e) => peerOf(pr, e)),
      source: findingSource('wvu-rotation'),
      numbers: { gapYears: gap, earlierYear: last.seasonYear, yearsApart: s.seasonYear - last.seasonYear, backFrom },
    });
  }
  for (const o of pr.soilBorne.get(s.plotId) ?? []) {
    if (o.plantingId === s.id || o.observedOn >= s.plantedOn || !partsOverlap(o.part, s.part)) continue;
    const seenYear = Number(o.observedOn.slice(0, 4));
    for (const rule of rulesFor(pr.ctx.diseaseRules, o.pestSlug!, crop)) {
      const years = rule.years.value;
      if (!withinGap(seenYear, s.seasonYear, years)) continue;
      const what = rule.families.includes(family) ? `the whole ${family} family` : lower(crop.commonName);
      out.push({
        key: `rotation_disease:${o.id}`,
        severity: 'clash',
        kind: 'rotation',
        rule: 'rotation_disease',
        title: `${o.name} in this soil`,
        message: `${crop.commonName} (${family}) here: ${lower(o.name)} was seen in this soil on ${o.observedOn}. Keep ${what} out of it for ${years} years, until ${seenYear + years}.${rule.note ? ` ${rule.note}` : ''}`,
        peers: [],
        source: findingSource(rule.years.source),
        numbers: { gapYears: years, seenYear, backFrom: seenYear + years },
      });
    }
  }
  return out;
}

function rulesFor(rules: DiseaseRotationRule[], disease: string, crop: Crop): DiseaseRotationRule[] {
  return rules.filter((r) => r.disease === disease && (r.families.includes(crop.family.value) || (r.crops ?? []).includes(crop.slug)));
}

function companionFindings(pr: Prepared, s: CheckPlanting, crop: Crop, plot: CheckPlot, box: Bounds): Draft[] {
  const out: Draft[] = [];
  const consider = (other: CheckPlanting, samePlot: boolean) => {
    if (other.id === s.id || other.cropId === s.cropId || !together(pr, s, other)) return;
    const rel = pr.relations.get(pairKey(s.cropId, other.cropId));
    if (!rel) return;
    const otherCrop = cropOf(pr, other)!;
    const otherPlot = pr.plots.get(other.plotId)!;
    let where: string;
    let distance = 0;
    if (samePlot) {
      where = 'in this plot';
    } else {
      if (rel.distanceM === null) return;
      distance = boxGap(box, plantingFootprint(otherPlot, other.part));
      if (distance > rel.distanceM + 1e-6) return;
      where = distance === 0 ? `next door in ${otherPlot.label}` : `in ${otherPlot.label}, ${metres(distance)} away`;
    }
    const harmful = rel.effect === 'antagonistic';
    const evidence = rel.evidence === 'research' ? 'research' : 'common practice';
    out.push({
      key: `companion:${other.id}`,
      severity: harmful ? (rel.severity ?? 'watch') : 'good',
      kind: 'companion',
      rule: harmful ? 'companion_harm' : 'companion_help',
      title: harmful ? `Poor neighbour: ${lower(otherCrop.commonName)}` : `Good pairing: ${lower(otherCrop.commonName)}`,
      message:
        `${otherCrop.commonName} ${where}: ${lower(crop.commonName)} and ${lower(otherCrop.commonName)} ${harmful ? 'do badly together' : 'do well together'} (${evidence}` +
        `${rel.distanceM !== null && !samePlot ? `, within ${metres(rel.distanceM)}` : ''}). ${rel.reason}`,
      peers: [peerOf(pr, other)],
      source: findingSource(rel.source, rel.evidence),
      numbers: samePlot ? {} : { distanceM: distance, withinM: rel.distanceM ?? 0 },
    });
  };
  for (const other of pr.bySeasonPlot.get(spKey(s.seasonYear, plot.id)) ?? []) consider(other, true);
  for (const n of pr.neighbours.get(plot.id) ?? []) {
    for (const other of pr.bySeasonPlot.get(spKey(s.seasonYear, n.plotId)) ?? []) consider(other, false);
  }
  return out;
}

/**
 * When a crop stands at its full height: from the start of its FAO-56 mid-season stage ("effective full
 * cover", Table 11 stage lengths in the crop notes), or halfway to its earliest harvest where the crop
 * has no stage lengths (our own stand-in).
 */
export function fullHeightFrom(pr: Prepared, p: CheckPlanting): string | null {
  const crop = cropOf(pr, p);
  if (!crop) return null;
  const st = crop.stages?.value;
  if (st) return plusDays(p.plantedOn, st.initial + st.development);
  const w = datesOf({ crop, method: p.method, date: p.plantedOn });
  if (!w) return null;
  return plusDays(p.plantedOn, Math.max(0, Math.round(daysBetween(p.plantedOn, w.harvest.earliest) / 2)));
}

/**
 * Dates the noon shadow is measured on: the shaded planting's sowing and the middle of its time in the
 * ground, and the day the tall crop reaches full height when that falls while the shaded one grows.
 */
function keyDates(pr: Prepared, s: CheckPlanting, tallFrom: string): string[] {
  const w = windowOf(pr, s);
  if (!w) return [s.plantedOn];
  const mid = plusDays(w.from, Math.floor(daysBetween(w.from, w.to) / 2));
  const dates = new Set([w.from, mid]);
  if (w.from < tallFrom && tallFrom <= w.to) dates.add(tallFrom);
  return [...dates].sort();
}

function inWindow(pr: Prepared, p: CheckPlanting, date: string): boolean {
  const w = windowOf(pr, p);
  return Boolean(w && w.from <= date && date <= w.to);
}

// Below, `?.` on a crop's values: a club's own crop may lack any value its form does not require, and a
// rule whose value is missing is not checked for it.

function shadeFindings(pr: Prepared, s: CheckPlanting, crop: Crop, plot: CheckPlot, box: Bounds): Draft[] {
  if (crop.sun?.value !== 'full_sun' || !crop.matureHeightCm) return [];
  const out: Draft[] = [];
  const lat = pr.ctx.site.latitude;
  const ownHeightM = crop.matureHeightCm.value.max / 100;
  for (const n of pr.neighbours.get(plot.id) ?? []) {
    const tallPlot = pr.plots.get(n.plotId)!;
    for (const t of pr.bySeasonPlot.get(spKey(s.seasonYear, n.plotId)) ?? []) {
      const tall = cropOf(pr, t);
      if (!tall?.matureHeightCm || tall.matureHeightCm.value.max < TALL_CROP_CM) continue;
      const heightM = tall.matureHeightCm.value.max / 100;
      if (heightM <= ownHeightM) continue;
      const tBox = plantingFootprint(tallPlot, t.part);
      const tallFrom = fullHeightFrom(pr, t);
      if (!tallFrom) continue;
      let worst: { date: string; elevation: number; shadow: number; distance: number; toward: 'north' | 'south' } | null = null;
      for (const date of keyDates(pr, s, tallFrom)) {
        // The tall crop casts its full shadow only once it stands at full height, until it is cleared.
        if (date < tallFrom || !inWindow(pr, t, date)) continue;
        const sun = noonSunDirection(date, lat);
        if (sun === 'overhead') continue;
        const toward = sun === 'south' ? 'north' : 'south';
        // The shaded planting must lie on the shadow's side, facing the tall one east-west.
        const distance = toward === 'north' ? tBox.minY - box.maxY : box.minY - tBox.maxY;
        if (distance < -1e-6 || eastWestOverlap(box, tBox) <= 1e-6) continue;
        const elevation = noonElevationDeg(date, lat);
        if (elevation <= 0) continue;
        const shadow = shadowLengthM(heightM, elevation);
        const gap = Math.max(0, distance);
        if (shadow >= gap + SHADE_MIN_REACH_M - 1e-9 && (!worst || shadow - gap > worst.shadow - worst.distance)) {
          worst = { date, elevation, shadow, distance: gap, toward };
        }
      }
      if (!worst) continue;
      out.push({
        key: `shade:${t.id}`,
        severity: 'watch',
        kind: 'shade',
        rule: 'shade',
        title: `Shade from ${lower(tall.commonName)} in ${tallPlot.label}`,
        message:
          `${tall.commonName} in ${tallPlot.label}, up to ${metres(heightM)} tall, casts a noon shadow of ${metres(worst.shadow)} on ${worst.date} ` +
          `(sun ${worst.elevation.toFixed(1)}° high at latitude ${lat}°); this ${lower(crop.commonName)} is ${metres(worst.distance)} to its ${worst.toward}, ` +
          `so the shadow reaches ${metres(worst.shadow - worst.distance)} into it, and it wants full sun.`,
        peers: [peerOf(pr, t)],
        source: findingSource('noon-shadow'),
        numbers: { shadowM: round2(worst.shadow), distanceM: round2(worst.distance), elevationDeg: round2(worst.elevation), heightM },
      });
    }
  }
  return out;
}

const round2 = (v: number) => Math.round(v * 100) / 100;

function siteFitFindings(pr: Prepared, s: CheckPlanting, crop: Crop, plot: CheckPlot): Draft[] {
  const out: Draft[] = [];
  const site = pr.ctx.site;
  const ph = crop.soilPh;
  if (ph && plot.soilPh !== null && (plot.soilPh < ph.value.min || plot.soilPh > ph.value.max)) {
    out.push({
      key: 'soil_ph',
      severity: 'watch',
      kind: 'site_fit',
      rule: 'soil_ph',
      title: plot.soilPh < ph.value.min ? 'Soil too acid' : 'Soil too alkaline',
      message: `The soil of ${plot.label} tested pH ${plot.soilPh}; ${lower(crop.commonName)} grows best at pH ${ph.value.min}–${ph.value.max}.`,
      peers: [],
      source: findingSource(ph.source),
      numbers: { soilPh: plot.soilPh, min: ph.value.min, max: ph.value.max },
    });
  }
  const depth = crop.minSoilDepthCm;
  if (depth && plot.soilDepthM !== null && (plot.kind === 'raised_bed' || plot.kind === 'container')) {
    const needCm = plot.kind === 'raised_bed' ? depth.value.raisedBed : depth.value.container;
    const haveCm = Math.round(plot.soilDepthM * 1000) / 10;
    if (haveCm < needCm) {
      const bed = plot.kind === 'raised_bed' ? 'raised bed' : 'container';
      out.push({
        key: 'soil_depth',
        severity: 'watch',
        kind: 'site_fit',
        rule: 'soil_depth',
        title: 'Soil too shallow',
        message: `This ${bed} holds ${haveCm} cm of soil; ${lower(crop.commonName)} needs at least ${needCm} cm in a ${bed}.`,
        peers: [],
        source: findingSource(depth.source),
        numbers: { haveCm, needCm },
      });
    }
  }
  if (crop.frost?.value === 'tender' && (site.lastSpringFrost || site.firstAutumnFrost)) {
    const dates = datesOf({
      crop,
      method: s.method,
      date: s.plantedOn,
      lastSpringFrost: site.lastSpringFrost ? `2000-${site.lastSpringFrost}` : undefined,
      firstAutumnFrost: site.firstAutumnFrost ? `2000-${site.firstAutumnFrost}` : undefined,
    });
    for (const w of dates?.warnings ?? []) {
      if (w.kind === 'before_last_frost') {
        out.push({
          key: 'frost',
          severity: 'watch',
          kind: 'site_fit',
          rule: 'frost',
          title: 'Before the last frost',
          message: `${crop.commonName} is killed by frost, and ${s.plantedOn} is ${daysBetween(s.plantedOn, w.lastFrost)} days before this site's usual last spring frost (${w.lastFrost}): cover it or wait.`,
          peers: [],
          source: findingSource(crop.frost.source),
          numbers: { daysBefore: daysBetween(s.plantedOn, w.lastFrost) },
        });
      } else if (w.kind === 'will_not_mature') {
        out.push({
          key: 'frost_autumn',
          severity: 'watch',
          kind: 'site_fit',
          rule: 'frost',
          title: 'Will not mature before frost',
          message: `${crop.commonName} planted on ${s.plantedOn} would not be ready before this site's usual first autumn frost (${w.firstFrost}).`,
          peers: [],
          source: findingSource(crop.daysToMaturity.source),
          numbers: {},
        });
      }
    }
  }
  if (s.method === 'sown' && site.soilTempsC && site.soilTempsC.length === 12) {
    const month = Number(s.plantedOn.slice(5, 7));
    const soil = site.soilTempsC[month - 1];
    const min = crop.germination?.value.minC;
    if (typeof soil === 'number' && min !== undefined && soil < min) {
      out.push({
        key: 'soil_temperature',
        severity: 'watch',
        kind: 'site_fit',
        rule: 'soil_temperature',
        title: 'Soil too cold to sow',
        message: `The site's soil is about ${soil} °C in this month; ${lower(crop.commonName)} seed needs at least ${min} °C to come up.`,
        peers: [],
        source: findingSource(crop.germination.source),
        numbers: { soilC: soil, minC: min },
      });
    }
  }
  return out;
}

/** The findings about one planting (saved or a draft), in a fixed order: rotation, companions, shade, site fit. */
export function findingsFor(pr: Prepared, s: CheckPlanting): Finding[] {
  const crop = cropOf(pr, s);
  const plot = pr.plots.get(s.plotId);
  if (!crop || !plot) return [];
  const box = plantingFootprint(plot, s.part);
  const drafts = [
    ...rotationFindings(pr, s, crop),
    ...companionFindings(pr, s, crop, plot, box),
    ...shadeFindings(pr, s, crop, plot, box),
    ...siteFitFindings(pr, s, crop, plot),
  ];
  return drafts.map((d) => ({ ...d, plantingId: s.id, plotId: plot.id, plotLabel: plot.label, cropName: crop.commonName, seasonYear: s.seasonYear }));
}

/** Every planting of the given plots (all of the site when omitted), with its findings. */
export function checkPlots(ctx: CheckContext, plotIds?: Iterable<number>): Finding[] {
  const pr = prepare(ctx);
  const wanted = plotIds ? new Set(plotIds) : null;
  const out: Finding[] = [];
  for (const p of ctx.plantings) if (!wanted || wanted.has(p.plotId)) out.push(...findingsFor(pr, p));
  return out;
}

/** The plots whose findings can change when something on `plotIds` changes: the plots and their neighbours. */
export function affectedPlots(ctx: CheckContext, plotIds: Iterable<number>): Set<number> {
  const pr = prepare({ ...ctx, plantings: [], observations: [], relations: [] });
  const out = new Set<number>();
  for (const id of plotIds) {
    out.add(id);
    for (const n of pr.neighbours.get(id) ?? []) out.add(n.plotId);
  }
  return out;
}

/** The index with a draft planting put in (replacing the saved planting of the same id, when editing). */
export function withDraft(pr: Prepared, draft: CheckPlanting): Prepared {
  const bySeasonPlot = new Map(pr.bySeasonPlot);
  const byPlot = new Map(pr.byPlot);
  const saved = draft.id === 0 ? undefined : pr.ctx.plantings.find((p) => p.id === draft.id);
  const strip = (l: CheckPlanting[] | undefined) => (l ?? []).filter((p) => draft.id === 0 || p.id !== draft.id);
  if (saved) {
    bySeasonPlot.set(spKey(saved.seasonYear, saved.plotId), strip(bySeasonPlot.get(spKey(saved.seasonYear, saved.plotId))));
    byPlot.set(saved.plotId, strip(byPlot.get(saved.plotId)));
  }
  const k = spKey(draft.seasonYear, draft.plotId);
  bySeasonPlot.set(k, [...strip(bySeasonPlot.get(k)), draft]);
  byPlot.set(draft.plotId, [...strip(byPlot.get(draft.plotId)), draft]);
  return { ...pr, bySeasonPlot, byPlot };
}

/** The findings of a planting not saved yet (or a saved one as the form now holds it): the same rules as a saved one. */
export function checkDraft(ctxOrPrepared: CheckContext | Prepared, draft: CheckPlanting): Finding[] {
  const pr = 'bySeasonPlot' in ctxOrPrepared ? ctxOrPrepared : prepare(ctxOrPrepared);
  return findingsFor(withDraft(pr, draft), draft);
}

export type { Prepared };
