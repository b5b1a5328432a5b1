import { OfferQuoteSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';

/** GET /api/seasons/:seasonId/offer-quote: what an offer would say (person, plot, deadline, fee); sends nothing. */
export function getOfferQuote(seasonId: number, plotId: number, applicationId: number) {
  return apiFetch(`/api/seasons/${seasonId}/offer-quote?plotId=${plotId}&applicationId=${applicationId}`, { schema: OfferQuoteSchema });
}
