import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import { describe, expect, it } from 'vitest';
import { formatPattern } from './pattern';

// date-fns's own `format` is the oracle: every pattern the product uses, on 2,000 instants spread over
// 1990–2060, in zones either side of UTC and across their clock changes.
const PATTERNS = ['d MMM yyyy', 'd MMM yyyy, HH:mm', 'yyyy-MM-dd', 'EEE d MMM', 'EEE d MMM yyyy', 'EEEE d MMMM', 'EEEE d MMMM yyyy', 'HH:mm', 'MMMM yyyy', 'd MMM', 'd'];
const ZONES = ['UTC', 'Europe/London', 'America/Chicago', 'Pacific/Auckland', 'Asia/Kolkata'];

describe('formatPattern', () => {
  it('writes every pattern the product uses as date-fns does, in every zone', () => {
    let seed = 42;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const from = Date.UTC(1990, 0, 1);
    const to = Date.UTC(2060, 11, 31);
    for (let i = 0; i < 2000; i++) {
      const at = new Date(from + Math.floor(next() * (to - from)));
      for (const zone of ZONES) {
        const d = new TZDate(at.getTime(), zone);
        for (const p of PATTERNS) expect(formatPattern(d, p), `${at.toISOString()} ${zone} ${p}`).toBe(format(d, p));
      }
    }
  });

  it('shows the wall clock of the zone: 23:30 UTC on 31 Dec is already New Year in Auckland', () => {
    const at = Date.UTC(2026, 11, 31, 23, 30);
    // computed: Auckland is UTC+13 in (southern) summer, so 12:30 on 1 January 2027
    expect(formatPattern(new TZDate(at, 'Pacific/Auckland'), 'EEE d MMM yyyy, HH:mm')).toBe('Fri 1 Jan 2027, 12:30');
    expect(formatPattern(new TZDate(at, 'UTC'), 'EEE d MMM yyyy, HH:mm')).toBe('Thu 31 Dec 2026, 23:30');
  });
});
