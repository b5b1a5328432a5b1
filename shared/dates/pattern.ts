// The few date-fns `format` patterns the product shows, written out so the plot holder's first page does not
// carry date-fns's formatter and English locale (about 5 KiB gzipped). Reads the date's own getters, so a
// TZDate gives the wall-clock values in its zone. shared/dates/pattern.test.ts checks it against date-fns.

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const DAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];
const two = (n: number) => String(n).padStart(2, '0');

/** Tokens: yyyy, MMMM, MMM, MM, dd, d, EEEE, EEE, HH, mm; anything else is kept as written. */
export function formatPattern(date: Date, pattern: string): string {
  return pattern.replace(/yyyy|MMMM|MMM|MM|dd|d|EEEE|EEE|HH|mm/g, (token) => {
    switch (token) {
      case 'yyyy':
        return String(date.getFullYear()).padStart(4, '0');
      case 'MMMM':
        return MONTHS[date.getMonth()];
      case 'MMM':
        return MONTHS[date.getMonth()].slice(0, 3);
      case 'MM':
        return two(date.getMonth() + 1);
      case 'dd':
        return two(date.getDate());
      case 'd':
        return String(date.getDate());
      case 'EEEE':
        return DAYS[date.getDay()];
      case 'EEE':
        return DAYS[date.getDay()].slice(0, 3);
      case 'HH':
        return two(date.getHours());
      default:
        return two(date.getMinutes());
    }
  });
}
