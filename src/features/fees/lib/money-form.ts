import { z } from 'zod';
import { localToday } from '@shared/dates';
import { parseMoney } from '@shared/fees/money';
import { ApiError, isApiError } from '@/lib/api/client';

/** A form field holding money as typed ("45.00"); its parsed value is whole minor units, read exactly. */
export const moneyText = z.string().transform((text, ctx) => {
  const result = parseMoney(text);
  if (!result.ok) {
    ctx.addIssue({ code: 'custom', message: result.message });
    return z.NEVER;
  }
  return result.minor;
});

/** The minor units typed into a money field, or null while it does not read as an amount. */
export function moneyOrNull(text: string | undefined): number | null {
  const result = parseMoney(text ?? '');
  return result.ok ? result.minor : null;
}

// Kept apart (no zod) for the first page's fee list; re-exported for the fee pages.
export { formatCalendarDate } from './calendar-date';

/** Today's date in the club's zone, as YYYY-MM-DD. */
export function todayIso(timeZone: string, now = new Date()): string {
  return localToday(timeZone, now);
}

/** The same API error with its field names moved to the form's names, so applyServerErrors puts them on the inputs. */
export function renameErrorFields(error: unknown, names: Record<string, string>): unknown {
  if (!isApiError(error) || !error.fields) return error;
  const fields = Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [names[k] ?? k, v]));
  return new ApiError({ status: error.status, code: error.code, message: error.message, fields, requestId: error.requestId });
}
