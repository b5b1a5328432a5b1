import { useMatch } from 'react-router-dom';

/** The club id in the URL (`/clubs/:clubId/...`), or null outside club pages or when it isn't a number. */
export function useCurrentClubId(): number | null {
  // useMatch works from layouts above the club routes, where useParams cannot see :clubId yet.
  const match = useMatch({ path: '/clubs/:clubId', end: false });
  const raw = match?.params.clubId;
  if (!raw || !/^\d+$/.test(raw)) return null;
  return Number(raw);
}
