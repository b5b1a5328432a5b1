import type { Crop } from '../crops/types';
import type { PlantingComputed } from '../schemas/plot-book';
import { plantingDates, type PlantingDates } from './dates';
import { plantsInArea, plantsInRows } from './spacing';

// What the plot book shows beside a planting, from the crop notes, the planting's part of the plot and
// the site: one place, so the server and any preview compute the same.

/** The planting as far as the summary needs it: the part's (or whole plot's) sides in metres, layout, rows, quantity, method and date. */
export interface PlantingShape {
  width: number;
  length: number;
  layout: 'rows' | 'intensive';
  rowCount: number | null;
  quantity: number | null;
  method: 'sown' | 'transplanted';
  /** YYYY-MM-DD. */
  plantedOn: string;
}

const positive = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : undefined);

/** What a site tells the plot book: typical frost dates ('MM-DD') and twelve monthly soil temperatures (°C), each possibly missing. */
export interface SiteClimate {
  lastSpringFrost: string | null;
  firstAutumnFrost: string | null;
  soilTempsC: number[] | null;
}

/**
 * A planting's dates as the plot book shows them: from the crop's values, the sowing month's soil
 * temperature in the site's table and the site's frost dates; null where the crop lacks a value.
 * The season's tasks are worked out from the same dates.
 */
export function plantingDatesFor(crop: Crop, p: Pick<PlantingShape, 'method' | 'plantedOn'>, climate: SiteClimate): { dates: PlantingDates | null; soilTempC: number | null } {
  const year = p.plantedOn.slice(0, 4);
  const month = Number(p.plantedOn.slice(5, 7));
  const soil = climate.soilTempsC?.[month - 1];
  const soilTempC = typeof soil === 'number' && Number.isFinite(soil) ? soil : null;
  let dates: PlantingDates | null;
  try {
    dates = plantingDates({
      crop,
      method: p.method,
      date: p.plantedOn,
      soilC: soilTempC ?? undefined,
      lastSpringFrost: climate.lastSpringFrost ? `${year}-${climate.lastSpringFrost}` : undefined,
      firstAutumnFrost: climate.firstAutumnFrost ? `${year}-${climate.firstAutumnFrost}` : undefined,
    });
  } catch {
    // A club's own crop may lack a value the dates need; the book still opens and says so.
    dates = null;
  }

  return { dates, soilTempC };
}

/**
 * A planting's computed facts from the crop notes: area, plants that fit (at the wider end of each
 * spacing range, the spacing plants end at after thinning; the holder's own row count when given), the
 * dates from plantingDates with the site's frost dates and the soil temperature of the planting's month.
 */
export function computePlanting(crop: Crop, p: PlantingShape, climate: SiteClimate): PlantingComputed {
  const areaM2 = p.width * p.length;
  const inRowCm = positive(crop.inRowCm?.value?.max);
  const betweenRowCm = positive(crop.betweenRowCm?.value?.max);
  const equalCm = positive(crop.equalSpacingCm?.value?.max);
  let plantsThatFit: PlantingComputed['plantsThatFit'] = null;
  if (p.layout === 'rows' && inRowCm) {
    if (p.rowCount !== null) {
      const fit = plantsInRows({ rowLengthM: Math.max(p.width, p.length), rows: p.rowCount, inRowCm });
      plantsThatFit = { ...fit, inRowCm, betweenRowCm: betweenRowCm ?? null };
    } else if (betweenRowCm) {
      const fit = plantsInArea({ widthM: p.width, lengthM: p.length, method: 'rows', inRowCm, betweenRowCm });
      plantsThatFit = { plants: fit.plants, rows: fit.rows, perRow: fit.perRow, inRowCm, betweenRowCm };
    }
  } else if (p.layout === 'intensive' && equalCm) {
    const fit = plantsInArea({ widthM: p.width, lengthM: p.length, method: 'intensive', equalSpacingCm: equalCm });
    plantsThatFit = { plants: fit.plants, rows: fit.rows, perRow: fit.perRow, inRowCm: equalCm, betweenRowCm: equalCm };
  }

  const { dates, soilTempC } = plantingDatesFor(crop, p, climate);

  const warnings: PlantingComputed['warnings'] = dates
    ? [...dates.warnings]
    : [{ kind: 'crop_notes_incomplete', message: 'The crop notes for this crop lack the values its dates need; add them in the crop notes.' }];
  if (plantsThatFit && plantsThatFit.plants === 0) {
    warnings.push({ kind: 'no_room', message: 'This part is narrower than one spacing of this crop; give the number of rows or a larger part.' });
  } else if (plantsThatFit && p.quantity !== null && p.quantity > plantsThatFit.plants) {
    warnings.push({ kind: 'crowded', message: `${p.quantity} plants are more than the ${plantsThatFit.plants} that fit at the crop's spacing.` });
  }
  return {
    areaM2,
    plantsThatFit,
    soilTempC,
    emergence: dates?.emergence
      ? { expected: dates.emergence.expected, earliest: dates.emergence.earliest, latest: dates.emergence.latest, basis: dates.emergence.estimate.basis }
      : null,
    thinning: dates?.thinning ?? null,
    sideDressing: dates?.sideDressing ?? null,
    harvestWindow: dates?.harvest ?? null,
    warnings,
  };
}

