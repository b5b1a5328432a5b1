import { z } from 'zod';
import { PlotKindSchema } from './plots';
import { UnitsSchema } from './sites';

/** The plot the signed-in holder has in a club's newest season that gives them one. */
export const MyPlotHoldingSchema = z.object({
  plotId: z.number().int(),
  label: z.string(),
  kind: PlotKindSchema,
  /** "3 m × 6 m" and "18 m²", in the site's units. */
  size: z.string(),
  area: z.string(),
  seasonYear: z.number().int(),
  site: z.object({
    id: z.number().int(),
    name: z.string(),
    width: z.number(),
    length: z.number(),
    units: UnitsSchema,
  }),
});
export type MyPlotHolding = z.infer<typeof MyPlotHoldingSchema>;

/** A renewal still waiting for the holder's answer (before its deadline). */
export const MyRenewalSchema = z.object({
  id: z.number().int(),
  seasonYear: z.number().int(),
  plotLabel: z.string(),
  siteName: z.string(),
  /** ISO instant; shown in the club's zone. */
  deadline: z.string(),
});
export type MyRenewal = z.infer<typeof MyRenewalSchema>;

/** GET /api/clubs/:clubId/my-plot: only the signed-in person's own holding and renewal. */
export const MyPlotSchema = z.object({
  holding: MyPlotHoldingSchema.nullable(),
  renewal: MyRenewalSchema.nullable(),
});
export type MyPlot = z.infer<typeof MyPlotSchema>;
