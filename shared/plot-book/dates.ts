import type { Crop, Range } from '../crops/types';
import { expectedEmergence, type EmergenceEstimate } from './emergence';

// A planting's dates are calendar dates ("YYYY-MM-DD", already in the site's time zone). They are
// counted as whole days since 1970-01-01 (UTC), so neither the machine’s zone nor a DST change
// can move a day; no instant or local clock is involved.

const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** Days after the expected emergence at which thinning is due: "soon after emergence" (common practice), taken as one week. */
export const THINNING_DAYS_AFTER_EMERGENCE = 7;

/**
 * Days added to (or taken from) the days to maturity when a crop is grown the other way than its
 * source counts: the age of a transplant when set out, taken as six weeks (common practice, from
 * memory; no published figure in the team's sources).
 */
export const TRANSPLANT_AGE_DAYS = 42;

const DAY_MS = 86_400_000;

// Calendar dates are counted as whole days since 1970-01-01 with Date.UTC: adding days is integer
// arithmetic, so no zone or DST change can move a day. (Plain arithmetic rather than date-fns here:
// the neighbour check works out thousands of planting dates per request, and a TZDate is slow to make.)
function dayNumber(isoDate: string): number {
  if (!CALENDAR_DATE.test(isoDate)) throw new RangeError(`Not a calendar date: ${isoDate}`);
  const y = Number(isoDate.slice(0, 4));
  const m = Number(isoDate.slice(5, 7));
  const d = Number(isoDate.slice(8, 10));
  const t = Date.UTC(y, m - 1, d);
  const back = new Date(t);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== m - 1 || back.getUTCDate() !== d) throw new RangeError(`Not a calendar date: ${isoDate}`);
  return t / DAY_MS;
}

function isoOf(dayNo: number): string {
  return new Date(dayNo * DAY_MS).toISOString().slice(0, 10);
}

/** The calendar date `days` after `isoDate` (negative goes back), as YYYY-MM-DD. */
export function plusDays(isoDate: string, days: number): string {
  if (!Number.isInteger(days)) throw new RangeError(`Whole days only, got ${days}`);
  return isoOf(dayNumber(isoDate) + days);
}

/** Whole calendar days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

// A site's frost dates are averages that recur each year, so only their month and day count
// (29 February is 28 February in other years); that lets a southern site's spring frost in
// September and autumn frost in April work without knowing the hemisphere.
/** The first date on or after `onOrAfter` that has the month and day of `frostDate`. */
export function nextOccurrence(frostDate: string, onOrAfter: string): string {
  dayNumber(frostDate);
  const m = Number(frostDate.slice(5, 7)) - 1;
  const d = Number(frostDate.slice(8, 10));
  const from = dayNumber(onOrAfter);
  for (let y = Number(onOrAfter.slice(0, 4)); ; y += 1) {
    const lastOfMonth = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
    const candidate = Date.UTC(y, m, Math.min(d, lastOfMonth)) / DAY_MS;
    if (candidate >= from) return isoOf(candidate);
  }
}

export type PlantingMethod = 'sown' | 'transplanted';

export interface PlantingInput {
  crop: Pick<Crop, 'daysToEmergence' | 'emergenceByTemperature' | 'germination' | 'daysToMaturity' | 'sideDressing' | 'frost'>;
  method: PlantingMethod;
  /** Sowing or transplanting date, YYYY-MM-DD in the site's zone. */
  date: string;
  /** Soil temperature at sowing, °C. */
  soilC?: number;
  /** The site's average last spring frost, YYYY-MM-DD (month and day used). */
  lastSpringFrost?: string;
  /** The site's average first autumn frost, YYYY-MM-DD (month and day used). */
  firstAutumnFrost?: string;
}

export type PlantingWarning =
  | { kind: 'before_last_frost'; message: string; lastFrost: string }
  | { kind: 'will_not_mature'; message: string; firstFrost: string }
  | { kind: 'harvest_cut_by_frost'; message: string; firstFrost: string }
  | { kind: 'soil_too_cold' | 'soil_too_hot'; message: string };

export interface DateWindow {
  earliest: string;
  latest: string;
}

export interface PlantingDates {
  /** Null for transplants (already up) and where the seed will not come up at this soil temperature. */
  emergence: (DateWindow & { expected: string; estimate: Extract<EmergenceEstimate, { comesUp: true }> }) | null;
  /** Thinning is for sown crops only. */
  thinning: string | null;
  /** Null when the crop needs no side-dressing or has no emergence to count from. */
  sideDressing: DateWindow | null;
  harvest: DateWindow & {
    countedFrom: 'sowing' | 'transplanting';
    /** Days added (+) or taken off (−) because the planting went in the other way than the source counts. */
    allowanceDays: number;
  };
  warnings: PlantingWarning[];
}

function windowFrom(start: string, range: Range, extra = 0): DateWindow {
  return { earliest: plusDays(start, range.min + extra), latest: plusDays(start, range.max + extra) };
}

/**
 * A planting's computed dates: emergence, thinning, side-dressing, harvest window, and the frost
 * warnings for tender crops.
 */
export function plantingDates(input: PlantingInput): PlantingDates {
  const { crop, method, date } = input;
  dayNumber(date);
  const warnings: PlantingWarning[] = [];

  let emergence: PlantingDates['emergence'] = null;
  if (method === 'sown') {
    const estimate = expectedEmergence(crop, input.soilC);
    if (estimate.comesUp) {
      emergence = {
        expected: plusDays(date, estimate.expectedDays),
        earliest: plusDays(date, estimate.rangeDays.min),
        latest: plusDays(date, estimate.rangeDays.max),
        estimate,
      };
    } else {
      warnings.push(
        estimate.reason === 'too_cold'
          ? { kind: 'soil_too_cold', message: 'The soil is too cold for this seed to come up; wait for warmer soil.' }
          : { kind: 'soil_too_hot', message: 'The soil is too hot for this seed to come up well; sow when it cools or shade the row.' },
      );
    }
  }

  const thinning = emergence ? plusDays(emergence.expected, THINNING_DAYS_AFTER_EMERGENCE) : null;

  const sd = crop.sideDressing.value;
  let sideDressing: DateWindow | null = null;
  if (sd.needed && sd.weeksAfterEmergence) {
    const from = method === 'transplanted' ? date : emergence?.expected;
    if (from) sideDressing = windowFrom(from, { min: sd.weeksAfterEmergence.min * 7, max: sd.weeksAfterEmergence.max * 7 });
  }

  const maturity = crop.daysToMaturity.value;
  const countedFrom = maturity.from;
  const grownAs = method === 'sown' ? 'sowing' : 'transplanting';
  // Days counted from transplanting leave out the weeks in the pot, which a direct sowing spends in
  // the ground; days counted from sowing include them, which a bought-in transplant has already had.
  const allowanceDays = countedFrom === grownAs ? 0 : countedFrom === 'transplanting' ? TRANSPLANT_AGE_DAYS : -TRANSPLANT_AGE_DAYS;
  const earliestDays = Math.max(0, maturity.min + allowanceDays);
  const latestDays = Math.max(earliestDays, maturity.max + allowanceDays);
  const harvest = { earliest: plusDays(date, earliestDays), latest: plusDays(date, latestDays), countedFrom, allowanceDays };

  if (crop.frost.value === 'tender') {
    if (input.lastSpringFrost && input.firstAutumnFrost) {
      // In the frost season the next last-spring-frost comes before the next first-autumn-frost.
      const nextSpring = nextOccurrence(input.lastSpringFrost, date);
      const nextAutumn = nextOccurrence(input.firstAutumnFrost, date);
      if (nextSpring <= nextAutumn) warnings.push(beforeFrost(nextSpring, method));
    } else if (input.lastSpringFrost) {
      // Without an autumn date, "before" means on or up to half a year before the spring frost date.
      const nextSpring = nextOccurrence(input.lastSpringFrost, date);
      if (daysBetween(date, nextSpring) < 183) warnings.push(beforeFrost(nextSpring, method));
    }
    if (input.firstAutumnFrost) {
      const frost = nextOccurrence(input.firstAutumnFrost, date);
      if (harvest.earliest >= frost) {
        warnings.push({ kind: 'will_not_mature', message: 'This planting will not mature before the first frost.', firstFrost: frost });
      } else if (harvest.latest >= frost) {
        warnings.push({ kind: 'harvest_cut_by_frost', message: 'The first frost is likely to end the harvest early.', firstFrost: frost });
      }
    }
  }

  return { emergence, thinning, sideDressing, harvest, warnings };
}

function beforeFrost(lastFrost: string, method: PlantingMethod): PlantingWarning {
  const verb = method === 'sown' ? 'Sown' : 'Transplanted';
  return { kind: 'before_last_frost', message: `${verb} on or before the last spring frost: this crop is killed by frost; cover it or wait.`, lastFrost };
}
