import type { currencies } from '@shared/schemas/clubs';

/** The names a club's currency goes by on forms (sign-up and settings). */
export const currencyLabels: Record<(typeof currencies)[number], string> = {
  GBP: 'Pound sterling (£)',
  EUR: 'Euro (€)',
  USD: 'US dollar ($)',
  CAD: 'Canadian dollar ($)',
  AUD: 'Australian dollar ($)',
  NZD: 'New Zealand dollar ($)',
};

/**
 * The browser's list of IANA time-zone names for a club's zone field. Older browsers lack the list;
 * the field then works as plain text and the server checks the name.
 */
export const timeZoneNames: string[] = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();
