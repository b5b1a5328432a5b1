import { describe, expect, it } from 'vitest';
import { PlotUpdateBodySchema } from './plots';
import { SiteUpdateBodySchema } from './sites';
import { ClubSettingsUpdateBodySchema } from './clubs';
import { CONTROL_CHARACTER_MESSAGE, csvFileSchema, IdSchema, parseIdText, textSchema } from './common';
import { PaymentBodySchema } from './fees';

// The API refuses unknown fields everywhere (DEVELOPERS.md); partial update bodies too.
describe('update bodies', () => {
  it('refuse unknown fields and take only the fields sent, without filling defaults', () => {
    expect(PlotUpdateBodySchema.safeParse({ version: 1, colour: 'red' }).success).toBe(false);
    expect(SiteUpdateBodySchema.safeParse({ version: 1, owner: 'x' }).success).toBe(false);
    expect(ClubSettingsUpdateBodySchema.safeParse({ slug: 'new' }).success).toBe(false);
    expect(PlotUpdateBodySchema.parse({ version: 2, x: 1.5 })).toEqual({ version: 2, x: 1.5 });
    expect(SiteUpdateBodySchema.parse({ version: 3, pathWidth: 1 })).toEqual({ version: 3, pathWidth: 1 });
  });
});

describe('shared input helpers', () => {
  it('caps ids at the integer column maximum, 2^31 − 1 (PostgreSQL manual, "Numeric Types")', () => {
    expect(IdSchema.safeParse(2147483647).success).toBe(true);
    expect(IdSchema.safeParse(2147483648).success).toBe(false);
    expect(IdSchema.safeParse(0).success).toBe(false);
    expect(IdSchema.safeParse(1.5).success).toBe(false);
    expect(parseIdText('2147483647')).toBe(2147483647);
    for (const bad of ['2147483648', '99999999999999999999', '0', '-1', '1.5', '1e3', '007', '', ' 1']) expect(parseIdText(bad)).toBeNull();
  });

  it('refuses NUL and other control characters in text, keeping line breaks only where text is multi-line', () => {
    const line = textSchema({ max: 50 });
    const block = textSchema({ max: 50, multiline: true });
    expect(line.safeParse('a\u0000b').success).toBe(false);
    expect(line.safeParse('two\nlines').success).toBe(false);
    expect(block.safeParse('two\nlines\tand a tab').success).toBe(true);
    expect(block.safeParse('a\u0000b').error?.issues[0].message).toBe(CONTROL_CHARACTER_MESSAGE);
    expect(line.parse('  Ada  ')).toBe('Ada');
  });

  it('names the line of a CSV file that holds a NUL, counting CRLF, LF and lone CR line ends', () => {
    const csv = csvFileSchema(1000, 'too big');
    const res = csv.safeParse('name,email\r\nA,a@example.org\rB,b@example.org\nC\u0000,c@example.org\n');
    expect(res.error?.issues[0].message).toMatch(/^Line 4 holds a NUL character/);
    expect(csv.safeParse('name,email\nA,a@example.org\n').success).toBe(true);
  });

  it('keeps payment dates from 2000-01-01 to a year ahead', () => {
    const paidOn = PaymentBodySchema.shape.paidOn;
    expect(paidOn.safeParse('0000-01-01').success).toBe(false);
    expect(paidOn.safeParse('1999-12-31').success).toBe(false);
    expect(paidOn.safeParse('9999-12-31').success).toBe(false);
    expect(paidOn.safeParse(new Date().toISOString().slice(0, 10)).success).toBe(true);
  });
});
