import { describe, expect, it } from 'vitest';
import { depositDue } from './compute';

// A deposit is held while a person holds a plot and returned when they give it up (common
// practice for community garden and allotment clubs), so a renewal asks only for a shortfall.
describe('depositDue', () => {
  it('asks a new holder for the whole deposit', () => {
    expect(depositDue(1500, 0)).toBe(1500);
  });
  it('asks nothing of a holder whose deposit is still held', () => {
    expect(depositDue(1500, 1500)).toBe(0);
  });
  it('asks only the difference after the club raised its deposit (computed: 2000 − 1500 = 500)', () => {
    expect(depositDue(2000, 1500)).toBe(500);
  });
  it('never asks a negative amount when more is held than the schedule asks', () => {
    expect(depositDue(1000, 1500)).toBe(0);
  });
});
