import { z } from 'zod';
import { PlotBookQuerySchema } from './plot-book';
import { UnitsSchema } from './sites';

// A club's harvest figures for one season, per crop: aggregated over every planting on the club's live
// sites, so it names nobody. Areas in m², weights in grams; the client converts at the edge.

/** ?year= picks the season; the club's current season when left out (same rule as the plot book). */
export const HarvestFiguresQuerySchema = PlotBookQuerySchema;
export type HarvestFiguresQuery = z.infer<typeof HarvestFiguresQuerySchema>;

const figures = {
  plantings: z.number().int(),
  areaM2: z.number(),
  /** Each planting's quantity when given, else the plants that fit; plantings with neither add nothing. */
  plants: z.number().int(),
  grams: z.number(),
  count: z.number().int(),
  /** Null when the area is zero. */
  gramsPerM2: z.number().nullable(),
  /** Over the plantings whose plants are known; null when none are. */
  gramsPerPlant: z.number().nullable(),
};

export const HarvestFigureSchema = z.object({
  crop: z.object({ id: z.number().int(), slug: z.string(), commonName: z.string() }),
  ...figures,
});
export type HarvestFigure = z.infer<typeof HarvestFigureSchema>;

export const HarvestFiguresSchema = z.object({
  /** The season shown; null for a club with no season yet. */
  season: z.object({ id: z.number().int(), year: z.number().int() }).nullable(),
  /** Every season year the club has, newest first, for the picker. */
  years: z.array(z.number().int()),
  /** The units of the club's main site (its oldest live site), metric when it has none. */
  units: UnitsSchema,
  items: z.array(HarvestFigureSchema),
  page: z.number().int(),
  total: z.number().int(),
  totals: z.object(figures),
});
export type HarvestFigures = z.infer<typeof HarvestFiguresSchema>;
