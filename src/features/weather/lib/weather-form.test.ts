import { describe, expect, it } from 'vitest';
import { readWeatherTexts, valueText, weatherFormSchema } from './weather-form';

describe('reading the weather forms', () => {
  it('turns US texts into SI at the columns’ precision (NIST SP 811: t/°C = (t/°F − 32)/1.8; 1 in = 25.4 mm)', () => {
    const { values, problems } = readWeatherTexts({ tMinC: '50', tMaxC: '68', rainMm: '0.45' }, 'us', 'omit');
    expect(problems).toEqual({});
    // computed: (68 − 32)/1.8 = 20 °C; 0.45 × 25.4 = 11.43 mm
    expect(values).toEqual({ tMinC: 10, tMaxC: 20, rainMm: 11.43 });
    expect(valueText('rainMm', 11.43, 'us')).toBe('0.45');
  });

  it('leaves blank inputs out for the gauge and clears them for the day’s form', () => {
    expect(readWeatherTexts({ rainMm: '3', tMinC: ' ' }, 'metric', 'omit').values).toEqual({ rainMm: 3 });
    expect(readWeatherTexts({ rainMm: '3', tMinC: '' }, 'metric', 'null').values).toEqual({ rainMm: 3, tMinC: null });
  });

  it('names each wrong input in the units typed', () => {
    const { problems } = readWeatherTexts({ rainMm: 'lots', tMinC: '20', tMaxC: '10', rhMaxPct: '101' }, 'metric', 'null');
    expect(problems).toEqual({
      rainMm: 'Enter a number, like 2.5 (with a dot for decimals)',
      tMinC: 'The lowest temperature is above the highest',
      rhMaxPct: 'At most 100 %',
    });
    // computed: 60 °C × 1.8 + 32 = 140 °F
    expect(readWeatherTexts({ tMaxC: '150' }, 'us', 'null').problems).toEqual({ tMaxC: 'At most 140 °F' });
  });

  it('asks the gauge for the rain and refuses a day after the site’s today', () => {
    const schema = weatherFormSchema({ keys: ['rainMm', 'tMinC', 'tMaxC'], units: 'metric', blank: 'omit', required: ['rainMm'], today: '2026-06-03' });
    const empty = schema.safeParse({ day: '2026-06-03', rainMm: '', tMinC: '', tMaxC: '' });
    expect(empty.success).toBe(false);
    expect(empty.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['rainMm', 'Enter a value']]);
    const future = schema.safeParse({ day: '2026-06-04', rainMm: '2', tMinC: '', tMaxC: '' });
    expect(future.error?.issues.map((i) => i.path.join('.'))).toEqual(['day']);
    expect(schema.parse({ day: '2026-06-03', rainMm: '12', tMinC: '', tMaxC: '' })).toEqual({ day: '2026-06-03', values: { rainMm: 12 } });
  });
});
