import type { PlantingCheckBody } from '@shared/schemas/plot-book';

/** A planting as the dry run takes it: the server fills the rest from PlantingCheckBodySchema's defaults. */
export type PlantingCheckInput = Partial<PlantingCheckBody> & Pick<PlantingCheckBody, 'cropId' | 'method' | 'plantedOn'>;

const CALENDAR_DATE = /^\d{4}-\d{2}-\d{2}$/;

function countOrNull(text: string, max: number): number | null {
  const t = text.trim();
  if (!/^\d+$/.test(t)) return null;
  const n = Number(t);
  return n >= 1 && n <= max ? n : null;
}

export interface PlantingFormValues {
  cropId: string;
  method: 'sown' | 'transplanted';
  plantedOn: string;
  layout: 'rows' | 'intensive';
  rowCount: string;
  quantity: string;
  status: PlantingCheckBody['status'];
}

/**
 * The dry-run body for what the form holds so far, or null until a crop and a date are filled in. Counts that are not
 * yet whole numbers in range are sent as "not given" so a half-typed box does not stop the check.
 */
export function draftFromForm(values: PlantingFormValues, part: PlantingCheckBody['part'], plantingId: number | null = null): PlantingCheckInput | null {
  const cropId = /^\d+$/.test(values.cropId) ? Number(values.cropId) : 0;
  if (cropId <= 0 || !CALENDAR_DATE.test(values.plantedOn)) return null;
  return {
    cropId,
    method: values.method,
    plantedOn: values.plantedOn,
    part,
    layout: values.layout,
    rowCount: countOrNull(values.rowCount, 1000),
    quantity: countOrNull(values.quantity, 1_000_000),
    status: values.status,
    plantingId,
  };
}
