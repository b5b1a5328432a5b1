import { useOutletContext } from 'react-router-dom';
import type { ClubMembership, SessionUser } from '@shared/schemas/auth';

/** What the signed-in shell hands to its child routes. */
export interface SignedInContext {
  user: SessionUser;
}

/** What a club route hands to its child routes: the person and their membership of this club. */
export interface ClubContext extends SignedInContext {
  club: ClubMembership;
}

/** The signed-in person, for routes under the app shell. */
export function useSignedInContext(): SignedInContext {
  return useOutletContext<SignedInContext>();
}

/** The person and the current club, for routes under `/clubs/:clubId`. */
export function useClubContext(): ClubContext {
  return useOutletContext<ClubContext>();
}
