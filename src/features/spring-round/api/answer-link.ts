import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { LinkAnswerSchema, LinkPreviewSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

export type LinkKind = 'offer' | 'renewal';
const base = (kind: LinkKind) => (kind === 'offer' ? '/api/offers' : '/api/renewals');

/** GET /api/offers/preview or /api/renewals/preview: what the e-mailed link is about. */
export function getLinkPreview(kind: LinkKind, token: string, signal?: AbortSignal) {
  return apiFetch(`${base(kind)}/preview?token=${encodeURIComponent(token)}`, { schema: LinkPreviewSchema, signal });
}

/** Query options for an offer or renewal link. */
export function linkPreviewQueryOptions(kind: LinkKind, token: string) {
  return queryOptions({
    queryKey: springRoundKeys.link({ kind, token }),
    queryFn: ({ signal }) => getLinkPreview(kind, token, signal),
    retry: false,
  });
}

/** The offer or renewal behind an e-mailed link. */
export function useLinkPreview(kind: LinkKind, token: string) {
  return useQuery(linkPreviewQueryOptions(kind, token));
}

const actions = { offer: { yes: 'accept', no: 'decline' }, renewal: { yes: 'keep', no: 'release' } } as const;

/** POST the person's answer: accept/decline an offer, keep/release a renewal. */
export function answerLink(kind: LinkKind, answer: 'yes' | 'no', token: string) {
  return apiFetch(`${base(kind)}/${actions[kind][answer]}`, { method: 'POST', body: { token }, schema: LinkAnswerSchema });
}

/** Sends the answer to an offer or renewal link. */
export function useAnswerLink(kind: LinkKind, token: string) {
  return useMutation({ mutationFn: (answer: 'yes' | 'no') => answerLink(kind, answer, token) });
}
