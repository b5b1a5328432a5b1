import { describe, expect, it } from 'vitest';
import { hoursProgress } from './hours';

describe('hours this season against the club’s ask', () => {
  it('fills the bar in proportion and says what is left in words', () => {
    // computed: 6 ÷ 10 = 60 %; 10 − 6 = 4 hours to go
    expect(hoursProgress(6, 10)).toEqual({ percent: 60, text: '6 of 10 hours given, 4 hours to go.' });
    // computed: 2.5 ÷ 8 = 31.25 % → 31; 8 − 2.5 = 5.5
    expect(hoursProgress(2.5, 8)).toEqual({ percent: 31, text: '2.5 of 8 hours given, 5.5 hours to go.' });
    expect(hoursProgress(0, 10).percent).toBe(0);
  });

  it('takes the server’s remaining figure when it sends one', () => {
    expect(hoursProgress(6, 10, 3).text).toBe('6 of 10 hours given, 3 hours to go.');
  });

  it('says the ask is met and stops the bar at full', () => {
    expect(hoursProgress(12, 10)).toEqual({ percent: 100, text: '12 hours given of the 10 hours the club asks for: that is met. Thank you!' });
    expect(hoursProgress(10, 10, 0).percent).toBe(100);
  });

  it('draws no bar when the club asks for no set number', () => {
    expect(hoursProgress(7.5, null)).toEqual({ percent: null, text: '7.5 hours given this season. The club asks for no set number of hours.' });
    expect(hoursProgress(1, 0).percent).toBe(100);
  });
});
