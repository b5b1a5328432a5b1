const STORAGE_KEY = 'tillwell.lastClubId';

/** Remembers the club the person last opened so "/" can take them back there. */
export function rememberClub(clubId: number): void {
  try {
    localStorage.setItem(STORAGE_KEY, String(clubId));
  } catch {
    // Private modes can refuse storage; the app then simply starts at the first club.
  }
}

/** Picks the remembered club if the person still belongs to it, else their first club, else null. */
export function pickStartClub(clubIds: readonly number[]): number | null {
  let remembered: number | null;
  try {
    const raw = localStorage.getItem(STORAGE_KEY);
    remembered = raw === null ? null : Number(raw);
  } catch {
    remembered = null;
  }
  if (remembered !== null && clubIds.includes(remembered)) return remembered;
  return clubIds[0] ?? null;
}
