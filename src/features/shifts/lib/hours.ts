import { hoursText } from './words';

export interface HoursProgress {
  /** How full the bar is drawn, 0 to 100; null when the club asks for no set number (no bar). */
  percent: number | null;
  /** The same in words, so the bar is never the only way to read it. */
  text: string;
}

/**
 * A volunteer's hours this season against what the club asks: "6 of 10 hours given, 4 hours to go",
 * "12 hours given: the club asks for 10, so that is met", or "7.5 hours given this season" when the
 * club asks for none. `remaining` is the server's figure when it sends one.
 */
export function hoursProgress(given: number, required: number | null, remaining?: number | null): HoursProgress {
  if (required === null) return { percent: null, text: `${hoursText(given)} given this season. The club asks for no set number of hours.` };
  if (required <= 0) return { percent: 100, text: `${hoursText(given)} given this season. The club asks for no hours, so there is nothing to make up.` };
  const left = Math.max(0, remaining ?? required - given);
  const percent = Math.min(100, Math.max(0, Math.round((given / required) * 100)));
  if (left <= 0) return { percent: 100, text: `${hoursText(given)} given of the ${hoursText(required)} the club asks for: that is met. Thank you!` };
  return { percent, text: `${shortOf(given)} of ${hoursText(required)} given, ${hoursText(left)} to go.` };
}

/** "6" (no unit), for "6 of 10 hours". */
function shortOf(n: number): string {
  return String(Math.round(n * 100) / 100);
}
