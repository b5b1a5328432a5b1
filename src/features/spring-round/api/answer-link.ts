import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { LinkAnswerSchema, LinkPreviewSchema } from '@shared/schemas/seasons';
import { apiFetch } from '@/lib/api/client';
import { springRoundKeys } from './keys';

export type LinkKind = 'offer' | 'renewal';
const base = (kind: LinkKind) => (kind === 'offer' ? '/api/offers' : '/api/renewals');

/**
 * What the page answers: the e-mailed token, or (a renewal only) its id when the holder is signed
 * in and came from the club home.
 */
export type LinkRef = { token: string } | { renewalId: number };

/** GET /api/offers/preview or /api/renewals/preview (by token), or /api/renewals/:id (signed in): what the link is about. */
export function getLinkPreview(kind: LinkKind, ref: LinkRef, signal?: AbortSignal) {
  const url = 'token' in ref ? `${base(kind)}/preview?token=${encodeURIComponent(ref.token)}` : `/api/renewals/${ref.renewalId}`;
  return apiFetch(url, { schema: LinkPreviewSchema, signal });
}

/** Query options for an offer or renewal link. */
export function linkPreviewQueryOptions(kind: LinkKind, ref: LinkRef) {
  return queryOptions({
    queryKey: springRoundKeys.link({ kind, ...ref }),
    queryFn: ({ signal }) => getLinkPreview(kind, ref, signal),
    retry: false,
  });
}

/** The offer or renewal behind an e-mailed link. */
export function useLinkPreview(kind: LinkKind, ref: LinkRef) {
  return useQuery(linkPreviewQueryOptions(kind, ref));
}

const actions = { offer: { yes: 'accept', no: 'decline' }, renewal: { yes: 'keep', no: 'release' } } as const;

/** POST the person's answer: accept/decline an offer, keep/release a renewal. */
export function answerLink(kind: LinkKind, answer: 'yes' | 'no', ref: LinkRef) {
  const action = actions[kind][answer];
  if ('token' in ref) return apiFetch(`${base(kind)}/${action}`, { method: 'POST', body: { token: ref.token }, schema: LinkAnswerSchema });
  return apiFetch(`/api/renewals/${ref.renewalId}/${action}`, { method: 'POST', schema: LinkAnswerSchema });
}

/** Sends the answer to an offer or renewal link. */
export function useAnswerLink(kind: LinkKind, ref: LinkRef) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (answer: 'yes' | 'no') => answerLink(kind, answer, ref),
    // The club home's "my plot" (with its renewal notice) is read again after an answer.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['plots', 'mine'] }),
  });
}
