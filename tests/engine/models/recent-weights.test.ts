import { describe, expect, it } from 'vitest';
import { recentWeights, rememberDay, RECENT_DAYS, RECENT_MIN_DAYS, type PartsDay } from '../../../src/engine/models/recent-weights';

const f = (...v: number[]) => Float64Array.from(v);

describe('recentWeights(days, current)', () => {
  // hand-worked: actual 10 every day; linear says 8, LEAR 11, the network 14.
  // 1/3 linear + 2/3 LEAR would be 10 exactly, but it is not on the grid of 0.05: LEAR 0.65 gives 0.35·8 + 0.65·11 = 9.95
  // (error 0.05), LEAR 0.7 gives 10.1; mixes with the network (14) are no better: 0.05·14 + 0.55·11 + 0.4·8 = 9.95 ties later
  const day: PartsDay = { actual: f(10), linear: f(8), lear: f(11), neural: f(14) };

  it('says nothing while fewer than RECENT_MIN_DAYS days are known', () => {
    const days: PartsDay[] = [];
    for (let k = 0; k < RECENT_MIN_DAYS - 1; k++) rememberDay(days, day);
    expect(recentWeights(days, { neural: 0, lear: 0 })).toBeUndefined();
  });

  it('switches to the best mix of the recent days when it beats the current weights by 3 %', () => {
    const days: PartsDay[] = [];
    for (let k = 0; k < RECENT_MIN_DAYS; k++) rememberDay(days, day);
    expect(recentWeights(days, { neural: 0, lear: 0 })).toEqual({ neural: 0, lear: 0.65 });
  });

  it('keeps the current weights when the best there does not beat them by 3 %', () => {
    const days: PartsDay[] = [];
    for (let k = 0; k < RECENT_MIN_DAYS; k++) rememberDay(days, day);
    expect(recentWeights(days, { neural: 0, lear: 0.65 })).toBeUndefined();
    // 0.7 on LEAR: error 0.1 against the best's 0.05, so it switches
    expect(recentWeights(days, { neural: 0, lear: 0.7 })).toEqual({ neural: 0, lear: 0.65 });
  });

  it('remembers only the newest RECENT_DAYS days', () => {
    const days: PartsDay[] = [];
    for (let k = 0; k < RECENT_DAYS + 5; k++) rememberDay(days, { ...day, actual: f(k) });
    expect(days).toHaveLength(RECENT_DAYS);
    expect(days[0].actual[0]).toBe(5);
  });
});
