import { z } from 'zod';

export const SeasonCreateBodySchema = z.strictObject({
  year: z.number().int().min(2000, 'A year like 2027').max(2100, 'A year like 2027'),
  /** When renewal links stop working; plots not kept by then are free. Defaults to the end of the club's day, its renewal days from today. */
  renewalDeadline: z.iso.datetime({ offset: true, message: 'A date and time' }).optional(),
});
export type SeasonCreateBody = z.infer<typeof SeasonCreateBodySchema>;

export const SeasonSchema = z.object({
  id: z.number().int(),
  clubId: z.number().int(),
  year: z.number().int(),
  renewalDeadline: z.string().nullable(),
  createdAt: z.string(),
  counts: z.object({
    renewalsPending: z.number().int(),
    renewalsKept: z.number().int(),
    renewalsReleased: z.number().int(),
    renewalsLapsed: z.number().int(),
    offersPending: z.number().int(),
    taken: z.number().int(),
  }),
});
export type Season = z.infer<typeof SeasonSchema>;

export const plotSeasonStatuses = ['free', 'renewal_pending', 'offered', 'taken'] as const;
export const PlotSeasonStatusSchema = z.enum(plotSeasonStatuses);
export type PlotSeasonStatus = z.infer<typeof PlotSeasonStatusSchema>;
export const plotSeasonStatusLabels: Record<PlotSeasonStatus, string> = {
  free: 'Free',
  renewal_pending: 'Waiting for renewal',
  offered: 'Offered',
  taken: 'Taken',
};

/** Where one plot stands in a season: who holds it, or who it is offered to and until when. */
export const PlotSeasonStateSchema = z.object({
  plotId: z.number().int(),
  status: PlotSeasonStatusSchema,
  holder: z.object({ userId: z.number().int(), name: z.string() }).nullable(),
  offer: z
    .object({ id: z.number().int(), applicationId: z.number().int(), name: z.string(), deadline: z.string() })
    .nullable(),
  renewal: z.object({ id: z.number().int(), name: z.string(), deadline: z.string() }).nullable(),
});
export type PlotSeasonState = z.infer<typeof PlotSeasonStateSchema>;

export const OfferCreateBodySchema = z.strictObject({
  plotId: z.number().int().positive(),
  applicationId: z.number().int().positive(),
  /** Defaults to the club's number of days to answer. */
  deadline: z.iso.datetime({ offset: true, message: 'A date and time' }).optional(),
});
export type OfferCreateBody = z.infer<typeof OfferCreateBodySchema>;

export const OfferSchema = z.object({
  id: z.number().int(),
  seasonId: z.number().int(),
  plotId: z.number().int(),
  applicationId: z.number().int(),
  status: z.enum(['pending', 'accepted', 'declined', 'lapsed', 'withdrawn']),
  deadline: z.string(),
  createdAt: z.string(),
});
export type Offer = z.infer<typeof OfferSchema>;

export const TokenBodySchema = z.strictObject({ token: z.string().min(20).max(200) });

/** What the person sees when they open an offer or renewal link. */
export const LinkPreviewSchema = z.object({
  kind: z.enum(['offer', 'renewal']),
  status: z.string(),
  clubName: z.string(),
  name: z.string(),
  year: z.number().int(),
  plot: z.object({ label: z.string(), siteName: z.string(), size: z.string(), area: z.string(), kind: z.string() }),
  deadline: z.string(),
  /** The club's zone, in which the page shows the deadline. */
  timeZone: z.string(),
  fee: z.object({ plotFeeMinor: z.number().int(), depositMinor: z.number().int(), currency: z.string() }).nullable(),
});
export type LinkPreview = z.infer<typeof LinkPreviewSchema>;

export const LinkAnswerSchema = z.object({ status: z.string(), message: z.string() });
