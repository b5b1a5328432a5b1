import { describe, expect, it } from 'vitest';
import { minorToDecimal, parseMoney } from './money';

const minor = (text: string) => {
  const r = parseMoney(text);
  if (!r.ok) throw new Error(`"${text}" was refused: ${r.message}`);
  return r.minor;
};
const message = (text: string) => {
  const r = parseMoney(text);
  if (r.ok) throw new Error(`"${text}" was read as ${r.minor}`);
  return r.message;
};

// Every expected value here is exact decimal arithmetic on the typed text (computed): two minor digits per unit.
describe('parseMoney', () => {
  it('reads whole amounts and one or two decimal places exactly', () => {
    expect(minor('45')).toBe(4500);
    expect(minor('45.5')).toBe(4550);
    expect(minor('45.05')).toBe(4505);
    expect(minor('45.00')).toBe(4500);
    expect(minor('45.')).toBe(4500);
    expect(minor('.5')).toBe(50);
    expect(minor('0')).toBe(0);
    expect(minor('007.10')).toBe(710);
  });

  it('has none of the binary rounding of float multiplication', () => {
    // In floating point 1.15 * 100 is 114.99999999999999 and 0.57 * 100 is 56.99999999999999.
    expect(1.15 * 100).not.toBe(115);
    expect(0.57 * 100).not.toBe(57);
    expect(minor('0.1')).toBe(10);
    expect(minor('1.15')).toBe(115);
    expect(minor('0.57')).toBe(57);
    expect(minor('4.35')).toBe(435);
    expect(minor('12.3')).toBe(1230);
  });

  it('accepts thousands separators in their places, spaces around and a leading currency sign', () => {
    expect(minor('1,234.56')).toBe(123456);
    expect(minor('12,345')).toBe(1234500);
    expect(minor('  20.00 ')).toBe(2000);
    expect(minor('£45.00')).toBe(4500);
    expect(minor('$ 3')).toBe(300);
  });

  it('refuses what it cannot read exactly, saying why', () => {
    expect(message('45.055')).toBe('Use at most 2 decimal places (whole pence or cents)');
    expect(message('-1')).toBe('Cannot be negative');
    expect(message('abc')).toBe('Enter an amount like 45.00');
    expect(message('')).toBe('Enter an amount');
    expect(message('   ')).toBe('Enter an amount');
    expect(message('1.2.3')).toBe('Enter an amount like 45.00');
    expect(message('12,34')).toBe('Put commas only between groups of three digits, like 1,234.56');
    expect(message('4 5')).toBe('Enter an amount like 45.00');
    expect(message('1e3')).toBe('Enter an amount like 45.00');
    expect(message('.')).toBe('Enter an amount like 45.00');
    expect(message('45.5x')).toBe('Enter an amount like 45.00');
  });

  it('caps amounts at the schemas’ 100,000,000 minor units', () => {
    expect(minor('1,000,000.00')).toBe(100_000_000);
    expect(message('1,000,000.01')).toBe('At most 1,000,000.00');
    expect(message('99999999999999999999')).toBe('At most 1,000,000.00');
  });
});

describe('minorToDecimal', () => {
  it('writes two places with no symbol, and reads back to the same minor units', () => {
    expect(minorToDecimal(4500)).toBe('45.00');
    expect(minorToDecimal(4505)).toBe('45.05');
    expect(minorToDecimal(5)).toBe('0.05');
    expect(minorToDecimal(0)).toBe('0.00');
    expect(minorToDecimal(-1500)).toBe('-15.00');
    for (const m of [0, 1, 99, 100, 123456, 100_000_000]) expect(minor(minorToDecimal(m))).toBe(m);
  });
});
