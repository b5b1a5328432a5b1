import { createContext, useContext, type ReactNode } from 'react';
import { formatDate, formatDateTime } from '@shared/dates';

const browserZone = (() => {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
})();

const TimeZoneContext = createContext<string | null>(null);

/** Shows every date and time below it in `zone` (the club's), whatever the reader's own zone is. */
export function TimeZoneProvider({ zone, children }: { zone: string; children: ReactNode }) {
  return <TimeZoneContext.Provider value={zone}>{children}</TimeZoneContext.Provider>;
}

/** The zone dates are shown in: the current club's; the browser's only outside a club (or before it has loaded). */
export function useTimeZone(): string {
  return useContext(TimeZoneContext) ?? browserZone;
}

/** A date (or, with `withTime`, a date and time) as the current club's people see it: in the club's zone. */
export function LocalDate({ value, withTime = false }: { value: string; withTime?: boolean }) {
  const zone = useTimeZone();
  return <>{withTime ? formatDateTime(value, zone) : formatDate(value, zone)}</>;
}
