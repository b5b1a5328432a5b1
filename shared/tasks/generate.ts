import type { Crop } from '../crops/types';
import { SAFETY_CAUTION } from '../crops/caution';
import { pestBySlug } from '../crops/pests';
import { cropSourceById } from '../crops/sources';
import { daysBetween, plusDays, type PlantingDates } from '../plot-book/dates';
import type { TaskKind } from '../schemas/tasks';
import { ET0_METHOD_WORDS, et0ForDay, kcOnDay, litresFor, needDay, usGallonsFromLitres, inchesFromMm, weeklyNeed, type Et0Method, type Et0Result, type NeedDay, type SiteClimate, type WeatherDay } from '../water';

// The season's care for one planting, worked out from its dates (the plot book's), the crop notes and
// the site's weather log. Pure: the server compares what this returns with the tasks it stored and
// writes only the difference, so running it again with nothing changed writes nothing.

/** Weeding every week from sowing or planting out until this long after the crop comes up: young plants compete poorly (common practice). */
export const WEEDING_WEEKS_AFTER_EMERGENCE = 4;
/** Scouting for the crop's pests every so many days from emergence to the first harvest (our own rhythm). */
export const SCOUTING_EVERY_DAYS = 14;
/** Mulch once the plants are established, this long after emergence or planting out (common practice: once seedlings are a few inches tall). */
export const MULCH_DAYS_AFTER_EMERGENCE = 21;
/** Quick crops are not worth mulching: only crops whose shortest time to maturity is this many days or more (our own threshold). */
export const MULCH_MIN_DAYS_TO_MATURITY = 60;
/** A week's deficit below this is not worth a watering trip (our own threshold; water deeply and less often is common practice). */
export const WATER_MIN_DEFICIT_MM = 5;
/** The generator plans watering for the current week and the next one only: further ahead the weather is unknown. */
export const WATER_WEEKS_AHEAD = 1;

const ESTIMATED_NOTE = 'estimated from the past week’s log';

export interface TaskPlantingInput {
  id: number;
  cropName: string;
  crop: Crop;
  method: 'sown' | 'transplanted';
  plantedOn: string;
  status: 'planned' | 'sown' | 'up' | 'harvesting' | 'finished' | 'failed';
  /** The plot book's dates for this planting (null where the crop notes lack what they need). */
  dates: PlantingDates | null;
  areaM2: number;
  plotLabel: string;
  plotKind: 'in_ground' | 'raised_bed' | 'container' | 'shared_bed';
}

export interface TaskSiteInput extends SiteClimate {
  units: 'metric' | 'us';
}

export interface TaskContext {
  site: TaskSiteInput;
  /** The site's weather log by date. */
  weather: Map<string, WeatherDay>;
  /** Multipliers of the water need for raised beds and containers (club settings). */
  factors: { raisedBed: number; container: number };
  /** Today in the site's time zone: windows that closed before it are history and never planned. */
  today: string;
}

/** A task as the generator wants it; `genKey` is its identity within the planting. */
export interface DesiredTask {
  genKey: string;
  kind: TaskKind;
  title: string;
  details: string;
  source: string;
  caution: string | null;
  dueOn: string;
  windowFrom: string;
  windowTo: string;
  amountMm: number | null;
  amountL: number | null;
}

const lower = (s: string) => s.toLowerCase();
const sourceTitle = (id: string) => cropSourceById(id)?.title ?? (id === 'common-practice' ? 'Common practice' : id);
const round1 = (v: number) => Math.round(v * 10) / 10;
export const TOOL_CAUTION = 'Wear gloves and sturdy shoes, keep blades sharp and pointed away from feet, and lift with bent knees.';
export const HEAT_CAUTION = 'In hot weather water early or late, drink water yourself, and lift full cans with bent knees; fill them only as full as you can carry.';

/** Monday of the week holding a date (weeks run Monday to Sunday, ISO 8601). */
export function weekStartOf(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  const dow = new Date(Date.UTC(y, m - 1, d)).getUTCDay(); // 0 = Sunday
  return plusDays(date, -((dow + 6) % 7));
}

const maxDate = (a: string, b: string) => (a > b ? a : b);
const minDate = (a: string, b: string) => (a < b ? a : b);

/** Every task the planting should have whose window has not closed by `today`, in date order. */
export function tasksForPlanting(p: TaskPlantingInput, ctx: TaskContext): DesiredTask[] {
  if (p.status === 'finished' || p.status === 'failed' || !p.dates) return [];
  const d = p.dates;
  const crop = p.crop;
  const name = lower(p.cropName);
  const up = d.emergence?.expected ?? p.plantedOn;
  const out: DesiredTask[] = [];

  // Weeding: weekly from a week after sowing or planting out until a few weeks after it comes up.
  const weedUntil = plusDays(up, WEEDING_WEEKS_AFTER_EMERGENCE * 7);
  for (let on = plusDays(p.plantedOn, 7); on <= weedUntil && on <= d.harvest.latest; on = plusDays(on, 7)) {
    out.push({
      genKey: `weed:${on}`,
      kind: 'weed',
      title: `Weed around the ${name}`,
      details:
        `Young ${name} compete poorly with weeds: hoe or pull them between the rows every week from sowing or planting out ` +
        `until about ${WEEDING_WEEKS_AFTER_EMERGENCE} weeks after the crop is up (up about ${up}, weeding until ${weedUntil}).`,
      source: 'Common practice',
      caution: TOOL_CAUTION,
      dueOn: on,
      windowFrom: on,
      windowTo: plusDays(on, 6),
      amountMm: null,
      amountL: null,
    });
  }

  // Thinning: soon after emergence, to the crop's in-row spacing.
  if (d.thinning) {
    const spacing = crop.inRowCm.value;
    out.push({
      genKey: `thin:${d.thinning}`,
      kind: 'thin',
      title: `Thin the ${name}`,
      details:
        `Thin the seedlings soon after they come up (about ${up}) to one every ${spacing.min}–${spacing.max} cm along the row, ` +
        'so each has room to grow; pinch or snip the extras rather than pulling, which disturbs the ones that stay.',
      source: `${sourceTitle(crop.inRowCm.source)} (spacing); thinning soon after emergence is common practice`,
      caution: null,
      dueOn: d.thinning,
      windowFrom: d.thinning,
      windowTo: plusDays(d.thinning, 7),
      amountMm: null,
      amountL: null,
    });
  }

  // Side-dressing: weeks after emergence (or planting out) as the crop notes say.
  if (d.sideDressing) {
    const w = crop.sideDressing.value.weeksAfterEmergence;
    out.push({
      genKey: `side_dress:${d.sideDressing.earliest}`,
      kind: 'side_dress',
      title: `Side-dress the ${name}`,
      details:
        `Feed along the rows ${w ? `${w.min}–${w.max} weeks` : 'some weeks'} after the crop ${p.method === 'transplanted' ? 'was planted out' : 'comes up'}: ` +
        'a band of compost or a balanced fertiliser beside the plants, watered in, not touching the stems.',
      source: sourceTitle(crop.sideDressing.source),
      caution: SAFETY_CAUTION,
      dueOn: d.sideDressing.earliest,
      windowFrom: d.sideDressing.earliest,
      windowTo: d.sideDressing.latest,
      amountMm: null,
      amountL: null,
    });
  }

  // Mulching: once, when the plants are established, for crops in the ground long enough to gain from it.
  if (crop.daysToMaturity.value.min >= MULCH_MIN_DAYS_TO_MATURITY) {
    const on = plusDays(up, MULCH_DAYS_AFTER_EMERGENCE);
    if (on < d.harvest.earliest) {
      out.push({
        genKey: `mulch:${on}`,
        kind: 'mulch',
        title: `Mulch the ${name}`,
        details: `Once the ${name} are established, a layer of about 5 cm of straw, leaves or compost between the plants keeps the soil moist and the weeds down.`,
        source: 'Common practice',
        caution: 'Lift bales and full barrows with bent knees; keep mulch a finger’s width from the stems.',
        dueOn: on,
        windowFrom: on,
        windowTo: plusDays(on, 13),
        amountMm: null,
        amountL: null,
      });
    }
  }

  // Scouting: the pests and diseases the crop notes list, every two weeks until the first harvest.
  const pests = crop.watchFor.map((slug) => pestBySlug(slug)?.name ?? slug);
  if (pests.length) {
    for (let on = plusDays(up, 7); on < d.harvest.earliest; on = plusDays(on, SCOUTING_EVERY_DAYS)) {
      out.push({
        genKey: `scout:${on}`,
        kind: 'scout',
        title: `Look over the ${name}`,
        details: `Check leaves (both sides), stems and the soil around them for ${listWords(pests.map(lower))}; record what you find in the plot book.`,
        source: 'The crop notes’ pests and diseases for this crop',
        caution: `If you decide to treat: ${SAFETY_CAUTION}`,
        dueOn: on,
        windowFrom: on,
        windowTo: plusDays(on, 6),
        amountMm: null,
        amountL: null,
      });
    }
  }

  // Harvest: the window from the crop notes' days to maturity.
  out.push({
    genKey: `harvest:${d.harvest.earliest}`,
    kind: 'harvest',
    title: `Harvest the ${name}`,
    details: `Ready from about ${d.harvest.earliest} to ${d.harvest.latest}, counted from ${d.harvest.countedFrom} (days to maturity ${crop.daysToMaturity.value.min}–${crop.daysToMaturity.value.max}).`,
    source: sourceTitle(crop.daysToMaturity.source),
    caution: null,
    dueOn: d.harvest.earliest,
    windowFrom: d.harvest.earliest,
    windowTo: d.harvest.latest,
    amountMm: null,
    amountL: null,
  });

  out.push(...wateringTasks(p, ctx));
  return out.filter((t) => t.windowTo >= ctx.today).sort((a, b) => a.dueOn.localeCompare(b.dueOn) || a.genKey.localeCompare(b.genKey));
}

function listWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

export function bedFactor(kind: TaskPlantingInput['plotKind'], factors: TaskContext['factors']): number {
  return kind === 'raised_bed' ? factors.raisedBed : kind === 'container' ? factors.container : 1;
}

export interface WaterWeek {
  weekStart: string;
  from: string;
  to: string;
  needMm: number;
  rainMm: number;
  deficitMm: number;
  meanKc: number;
  meanEt0: number;
  days: number;
  methods: Record<string, number>;
  estimatedDays: number;
  factor: number;
}

/**
 * The ET0 of a day: the log's when the day has passed (FAO-56 Penman-Monteith, Hargreaves or the rule
 * of thumb by what the log holds); for a day still to come, the mean of the logged days of the week
 * before today, or the rule of thumb when none were logged.
 */
export function et0Estimate(date: string, ctx: TaskContext): Et0Result & { estimated: boolean } {
  if (date <= ctx.today) return { ...et0ForDay(ctx.weather.get(date) ?? null, ctx.site), estimated: false };
  const recent: Et0Result[] = [];
  for (let i = 0; i < 7; i++) {
    const day = ctx.weather.get(plusDays(ctx.today, -i));
    if (day) recent.push(et0ForDay(day, ctx.site));
  }
  if (recent.length) {
    const mm = recent.reduce((a, r) => a + r.mm, 0) / recent.length;
    const counts = new Map<Et0Result['method'], number>();
    for (const r of recent) counts.set(r.method, (counts.get(r.method) ?? 0) + 1);
    const method = [...counts].sort((a, b) => b[1] - a[1])[0][0];
    return { mm, method, note: ESTIMATED_NOTE, estimated: true };
  }
  return { ...et0ForDay(null, ctx.site), estimated: true };
}

/** One week's water for a planting, over the days of the week it is in the ground. */
export function waterWeek(p: TaskPlantingInput, ctx: TaskContext, weekStart: string): WaterWeek | null {
  const end = p.dates ? p.dates.harvest.latest : p.plantedOn;
  const from = maxDate(weekStart, p.plantedOn);
  const to = minDate(plusDays(weekStart, 6), end);
  if (from > to) return null;
  const factor = bedFactor(p.plotKind, ctx.factors);
  const days: NeedDay[] = [];
  let estimatedDays = 0;
  const methods: Record<string, number> = {};
  for (let on = from; on <= to; on = plusDays(on, 1)) {
    const et0 = et0Estimate(on, ctx);
    // The rule of thumb is already a crop's need (about an inch a week), so Kc does not scale it.
    const kc = et0.method !== 'rule_of_thumb' && p.crop.kc && p.crop.stages ? kcOnDay(p.crop.kc.value, p.crop.stages.value, daysBetween(p.plantedOn, on)).kc : 1;
    // Rain only counts on days that have passed; a day to come has none logged yet.
    days.push(needDay({ date: on, et0, kc, factor, rainMm: on <= ctx.today ? ctx.weather.get(on)?.rainMm : 0 }));
    if (et0.estimated && et0.note === ESTIMATED_NOTE) estimatedDays++;
    methods[et0.method] = (methods[et0.method] ?? 0) + 1;
  }
  const sum = weeklyNeed(days);
  return {
    weekStart,
    from,
    to,
    ...sum,
    meanKc: days.reduce((a, d) => a + d.kc, 0) / days.length,
    meanEt0: days.reduce((a, d) => a + d.et0.mm, 0) / days.length,
    days: days.length,
    methods,
    estimatedDays,
    factor,
  };
}

/** How a week's water reads to a person: the amount first, then the sum that gave it. */
export function explainWaterWeek(p: TaskPlantingInput, w: WaterWeek, units: 'metric' | 'us'): { title: string; details: string; amountL: number } {
  const litres = litresFor(w.deficitMm, p.areaM2);
  const amount = units === 'us' ? `${round1(usGallonsFromLitres(litres))} US gal` : `${Math.round(litres)} L`;
  const mm = (v: number) => (units === 'us' ? `${inchesFromMm(v).toFixed(2)} in` : `${Math.round(v)} mm`);
  const area = units === 'us' ? `${round1(p.areaM2 / 0.09290304)} ft²` : `${round1(p.areaM2)} m²`;
  const bed = p.plotKind === 'raised_bed' ? 'raised bed' : p.plotKind === 'container' ? 'container' : 'bed';
  const how = Object.entries(w.methods)
    .map(([m, n]) => `${ET0_METHOD_WORDS[m as Et0Method] ?? m}${Object.keys(w.methods).length > 1 ? ` ${n} d` : ''}`)
    .join(', ');
  const factor = w.factor !== 1 ? ` × ${w.factor} for a ${bed}` : '';
  const estimated = w.estimatedDays ? `; ${w.estimatedDays} of the days still to come, estimated from the past week’s log` : '';
  return {
    title: `Water the ${lower(p.cropName)}: ${amount}`,
    details:
      `Water ${amount} over this ${area} ${bed}: need ${mm(w.needMm)} this week (${lower(p.cropName)}, Kc ${w.meanKc.toFixed(2)} × ET0 ${units === 'us' ? `${inchesFromMm(w.meanEt0).toFixed(2)} in/day` : `${w.meanEt0.toFixed(1)} mm/day`} × ${w.days} days${factor}, ${how}${estimated}), ` +
      `rain logged ${mm(w.rainMm)}, deficit ${mm(w.deficitMm)}.`,
    amountL: litres,
  };
}

function wateringTasks(p: TaskPlantingInput, ctx: TaskContext): DesiredTask[] {
  if (!p.dates) return [];
  const out: DesiredTask[] = [];
  const thisWeek = weekStartOf(ctx.today);
  for (let k = 0; k <= WATER_WEEKS_AHEAD; k++) {
    const weekStart = plusDays(thisWeek, 7 * k);
    const w = waterWeek(p, ctx, weekStart);
    if (!w || w.deficitMm < WATER_MIN_DEFICIT_MM) continue;
    const text = explainWaterWeek(p, w, ctx.site.units);
    const due = minDate(maxDate(plusDays(weekStart, 3), w.from), w.to);
    out.push({
      genKey: `water:${weekStart}`,
      kind: 'water',
      title: text.title,
      details: text.details,
      source:
        'FAO Irrigation and Drainage Paper 56 (reference evapotranspiration, Kc by growth stage from Tables 11 and 12); ' +
        'about 25 mm a week where the log has nothing (UF/IFAS Gardening Solutions, Purdue Landscape Report)',
      caution: HEAT_CAUTION,
      dueOn: due,
      windowFrom: w.from,
      windowTo: w.to,
      amountMm: round1(w.deficitMm),
      amountL: round1(text.amountL),
    });
  }
  return out;
}
