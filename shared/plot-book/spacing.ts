// How many plants of a crop fit in a row or a bed. Lengths come in metres (as the map stores
// them) and spacings in centimetres (as the crop notes store them).
//
// Edge rule, the same everywhere: each plant owns one spacing of row (half a spacing either
// side of it), so a row of length L at spacing s holds floor(L / s) plants, with half a
// spacing left free at each end; there is no extra plant "at each end". Likewise a bed of
// width W holds floor(W / between-row spacing) rows, each with half a row gap to the edge.
// A 10 ft row at 2 in is therefore 60 plants, not 61.

/** Binary noise in metres-over-centimetres (3.048 / 0.0508 = 59.99999…) must not lose a plant. */
const EPSILON = 1e-9;

function fits(lengthM: number, spacingCm: number): number {
  if (!(spacingCm > 0) || !Number.isFinite(spacingCm)) throw new RangeError(`Spacing must be a positive number of centimetres, got ${spacingCm}`);
  if (!(lengthM >= 0) || !Number.isFinite(lengthM)) throw new RangeError(`Length must be zero or more metres, got ${lengthM}`);
  return Math.floor((lengthM * 100) / spacingCm + EPSILON);
}

export interface RowsFit {
  /** Plants in all rows together. */
  plants: number;
  rows: number;
  perRow: number;
}

/** The plants that fit in `rows` rows of `rowLengthM` metres at `inRowCm` apart, floor(length / spacing) per row. */
export function plantsInRows(opts: { rowLengthM: number; rows: number; inRowCm: number }): RowsFit {
  if (!Number.isInteger(opts.rows) || opts.rows < 0) throw new RangeError(`Rows must be a whole number, got ${opts.rows}`);
  const perRow = fits(opts.rowLengthM, opts.inRowCm);
  return { plants: perRow * opts.rows, rows: opts.rows, perRow };
}

export type SpacingMethod = 'rows' | 'intensive';

export interface AreaFit extends RowsFit {
  method: SpacingMethod;
  /** The bed's area, m². */
  areaM2: number;
  /** Row length used: the bed's longer side. */
  rowLengthM: number;
}

export interface AreaInput {
  widthM: number;
  lengthM: number;
  method: SpacingMethod;
  /** Needed for `rows`. */
  inRowCm?: number;
  /** Needed for `rows`. */
  betweenRowCm?: number;
  /** Needed for `intensive`: the square grid's spacing each way. */
  equalSpacingCm?: number;
}

/**
 * The plants that fit in a rectangular bed: rows run along the longer side (rows × plants per
 * row) for `rows`, or a square grid at the equal spacing for `intensive`; with the area in m².
 */
export function plantsInArea(input: AreaInput): AreaFit {
  const longer = Math.max(input.widthM, input.lengthM);
  const shorter = Math.min(input.widthM, input.lengthM);
  const areaM2 = input.widthM * input.lengthM;
  let rows: number;
  let perRow: number;
  if (input.method === 'rows') {
    if (input.inRowCm === undefined || input.betweenRowCm === undefined) throw new RangeError('Rows need both in-row and between-row spacing');
    rows = fits(shorter, input.betweenRowCm);
    perRow = fits(longer, input.inRowCm);
  } else {
    if (input.equalSpacingCm === undefined) throw new RangeError('An intensive bed needs the equal spacing');
    rows = fits(shorter, input.equalSpacingCm);
    perRow = fits(longer, input.equalSpacingCm);
  }
  return { method: input.method, plants: rows * perRow, rows, perRow, areaM2, rowLengthM: longer };
}

/** Plants per square foot on a square grid at `spacingIn` inches, (12 / s)², without the edge rule. */
export function gridPlantsPerSquareFoot(spacingIn: number): number {
  if (!(spacingIn > 0)) throw new RangeError(`Spacing must be positive, got ${spacingIn}`);
  return (12 / spacingIn) ** 2;
}

/** Plants per square metre on a square grid at `spacingCm`, (100 / s)², without the edge rule. */
export function gridPlantsPerSquareMetre(spacingCm: number): number {
  if (!(spacingCm > 0)) throw new RangeError(`Spacing must be positive, got ${spacingCm}`);
  return (100 / spacingCm) ** 2;
}
