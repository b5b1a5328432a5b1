import { z } from 'zod';
import { IdSchema, IdTextSchema, instantSchema } from './common';

export const SeasonCreateBodySchema = z.strictObject({
  year: z.number().int().min(2000, 'A year like 2027').max(2100, 'A year like 2027'),
  /** When renewal links stop working; plots not kept by then are free. Defaults to the end of the club's day, its renewal days from today. */
  renewalDeadline: instantSchema('A date and time').optional(),
});
export type SeasonCreateBody = z.infer<typeof SeasonCreateBodySchema>;

export const SeasonSchema = z.object({
  id: z.number().int(),
  clubId: z.number().int(),
  year: z.number().int(),
  renewalDeadline: z.string().nullable(),
  createdAt: z.string(),
  /** The coordinator who opened it (null once their account is gone). */
  openedBy: z.string().nullable(),
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

export const SeasonOpeningQuerySchema = z.object({
  year: z.coerce.number().int().min(2000, 'A year like 2027').max(2100, 'A year like 2027'),
});

/** What opening a season would do, shown before anything is sent. */
export const SeasonOpeningPreviewSchema = z.object({
  year: z.number().int(),
  /** The season whose holders get renewals (null for a club's first season). */
  previousYear: z.number().int().nullable(),
  /** How many renewal e-mails would go. */
  renewals: z.number().int(),
  notRenewed: z.array(z.object({ name: z.string(), plotLabel: z.string(), reason: z.string() })),
});
export type SeasonOpeningPreview = z.infer<typeof SeasonOpeningPreviewSchema>;

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
  plotId: IdSchema,
  applicationId: IdSchema,
  /** Defaults to the club's number of days to answer. */
  deadline: instantSchema('A date and time').optional(),
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

export const OfferQuoteQuerySchema = z.object({
  plotId: IdTextSchema,
  applicationId: IdTextSchema,
});

/** What an offer would say before it is sent: to whom, which plot, answer by when, and what it costs. */
export const OfferQuoteSchema = z.object({
  personName: z.string(),
  personEmail: z.string(),
  plotLabel: z.string(),
  siteName: z.string(),
  /** When the offer would lapse if it were sent now (ISO instant). */
  deadline: z.string(),
  /** Days the club gives to answer. */
  offerDays: z.number().int(),
  fee: z.object({
    plotFeeMinor: z.number().int(),
    depositMinor: z.number().int(),
    totalMinor: z.number().int(),
    currency: z.string(),
  }),
  /** Whether the plot meets what the person asked for (accessible, raised, site). */
  fitsNeeds: z.boolean(),
});
export type OfferQuote = z.infer<typeof OfferQuoteSchema>;

/** A holder of last season who got no renewal in this one, with the reason as it stands now. */
export const LeftOutHolderSchema = z.object({
  allocationId: z.number().int(),
  userId: z.number().int(),
  name: z.string(),
  plotId: z.number().int(),
  plotLabel: z.string(),
  siteName: z.string(),
  /** Still owed on last season's fee, in minor units (0 once paid). */
  owedMinor: z.number().int(),
  currency: z.string(),
  reason: z.string(),
  /** True when the coordinator can send a renewal now (paid up, and the plot is still free). */
  canRenew: z.boolean(),
});
export type LeftOutHolder = z.infer<typeof LeftOutHolderSchema>;

export const LateRenewalBodySchema = z.strictObject({
  allocationId: IdSchema,
});
export type LateRenewalBody = z.infer<typeof LateRenewalBodySchema>;
