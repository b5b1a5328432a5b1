import { describe, expect, it } from 'vitest';
import { meetsNeeds, suggestApplicant, type SuggestPerson } from './suggest';

const person = (id: number, o: Partial<SuggestPerson> = {}): SuggestPerson => ({
  id,
  preferredSize: 'any',
  needsAccessible: false,
  needsRaised: false,
  preferredSiteId: null,
  ...o,
});

// Fair order is application date, respecting needs such as an accessible bed (common practice
// for club waitlists; no published source).
describe('suggesting the next person for a free plot', () => {
  const inGround = { kind: 'in_ground' as const, isAccessible: false, siteId: 1 };
  const accessibleRaised = { kind: 'raised_bed' as const, isAccessible: true, siteId: 1 };

  it('takes the earliest person whose needs the plot meets', () => {
    const queue = [person(1, { needsAccessible: true }), person(2), person(3)];
    expect(suggestApplicant(inGround, queue)?.id).toBe(2);
  });

  it('gives an accessible raised bed first to the earliest person who needs one, even if others waited longer', () => {
    const queue = [person(1), person(2, { preferredSize: 'small' }), person(3, { needsAccessible: true, needsRaised: true })];
    expect(suggestApplicant(accessibleRaised, queue)?.id).toBe(3);
  });

  it('prefers someone who asked for that size, then anyone it suits', () => {
    const queue = [person(1, { preferredSize: 'small' }), person(2, { preferredSize: 'large' })];
    expect(suggestApplicant(inGround, queue)?.id).toBe(2);
    expect(suggestApplicant(inGround, [person(1, { preferredSize: 'small' })])?.id).toBe(1);
  });

  it('respects a preferred site and returns null when nobody fits', () => {
    const queue = [person(1, { preferredSiteId: 2 }), person(2, { needsRaised: true })];
    expect(meetsNeeds(queue[0], inGround)).toBe(false);
    expect(suggestApplicant(inGround, queue)).toBeNull();
    expect(suggestApplicant({ ...inGround, siteId: 2 }, queue)?.id).toBe(1);
  });
});
