import { describe, expect, it } from 'vitest';
import { shiftStates } from '@shared/schemas/shifts';
import { estimateText, hoursText, placesLeftText, placesText, plotsText, stateWords } from './words';

describe('shift words', () => {
  it('names every state in plain words, each different', () => {
    expect(shiftStates.map((s) => stateWords[s])).toEqual(['Needs people', 'Covered', 'Done', 'Not done', 'Called off']);
    expect(new Set(Object.values(stateWords)).size).toBe(shiftStates.length);
  });

  it('says how many places are taken and how many are left', () => {
    expect(placesText(2, 3)).toBe('2 of 3 taken');
    expect(placesText(0, 1)).toBe('0 of 1 taken');
    expect(placesLeftText(2, 3)).toBe('1 place left');
    expect(placesLeftText(0, 4)).toBe('4 places left');
    expect(placesLeftText(3, 3)).toBe('Every place taken');
    // A coordinator may lower the places below those already taken.
    expect(placesLeftText(4, 3)).toBe('Every place taken');
  });

  it('gives hours as a person says them', () => {
    expect(hoursText(1)).toBe('1 hour');
    expect(hoursText(1.5)).toBe('1.5 hours');
    expect(hoursText(2)).toBe('2 hours');
    expect(hoursText(0)).toBe('0 hours');
    // computed: 0.75 h × 60 = 45 minutes; 0.25 h × 60 = 15 minutes
    expect(hoursText(0.75)).toBe('45 minutes');
    expect(hoursText(0.25)).toBe('15 minutes');
    expect(hoursText(1.25)).toBe('1.25 hours');
    expect(estimateText(1.5)).toBe('About 1.5 hours');
  });

  it('lists a shift’s plots, shortening a long list', () => {
    expect(plotsText([])).toBeNull();
    expect(plotsText(['A-1'])).toBe('Plot A-1');
    expect(plotsText(['A-1', 'A-1', 'B-2'])).toBe('Plots A-1 and B-2');
    expect(plotsText(['A-1', 'A-2', 'A-3', 'B-1'])).toBe('Plots A-1, A-2, A-3 and B-1');
    expect(plotsText(['A-1', 'A-2', 'A-3', 'B-1', 'B-2', 'B-3'])).toBe('Plots A-1, A-2, A-3 and 3 more');
    expect(plotsText(['A-1', 'A-2', 'A-3', 'B-1', 'B-2', 'B-3'], { all: true })).toBe('Plots A-1, A-2, A-3, B-1, B-2 and B-3');
  });
});
