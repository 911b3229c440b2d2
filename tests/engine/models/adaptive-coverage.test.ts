import { describe, expect, it } from 'vitest';
import { ADAPT_RATE, adaptCoverage, missedShare } from '../../../src/engine/models/adaptive-coverage';

// Adaptive conformal inference, Gibbs & Candès (2021), NeurIPS 34: alpha_{t+1} = alpha_t + gamma (alpha - err_t),
// written for the coverage c = 1 - alpha: c_{t+1} = c_t + gamma (err_t - (1 - c)). Hand-worked values.
describe('adaptCoverage(nominal, current, missed)', () => {
  it('takes the published step: a day that missed 30 % at nominal 90 % raises the coverage by gamma x 0.2', () => {
    expect(ADAPT_RATE).toBe(0.05);
    expect(adaptCoverage(0.9, 0.9, 0.3)).toBeCloseTo(0.9 + 0.05 * 0.2, 12);
  });

  it('lowers it after a day without a miss, and leaves it where the misses match the nominal share', () => {
    expect(adaptCoverage(0.8, 0.8, 0)).toBeCloseTo(0.8 - 0.05 * 0.2, 12);
    expect(adaptCoverage(0.8, 0.83, 0.2)).toBeCloseTo(0.83, 12);
  });

  it('stays within 0.15 of nominal and below 0.995, and ignores a day with no known price', () => {
    expect(adaptCoverage(0.98, 0.994, 1)).toBe(0.995);
    expect(adaptCoverage(0.5, 0.36, 0)).toBe(0.35);
    expect(adaptCoverage(0.9, 0.91, NaN)).toBe(0.91);
  });

  it('brings the long-run miss share to nominal when the errors are wider than the pool says', () => {
    // new errors uniform on [-1.2, 1.2], the pool's on [-1, 1]: a band built at coverage c spans [-c, c], so it
    // misses 1 - c / 1.2; at nominal 50 % that is 58 % unadapted, and the average miss share tends to 0.5 (c -> 0.6)
    let c = 0.5, missed = 0;
    const days = 4000;
    for (let t = 0; t < days; t++) {
      const miss = 1 - c / 1.2;
      missed += miss;
      c = adaptCoverage(0.5, c, miss);
    }
    expect(missed / days).toBeCloseTo(0.5, 2);
    expect(c).toBeCloseTo(0.6, 6);
  });
});

describe('missedShare(actual, lower, upper)', () => {
  it('counts the known prices outside the band, edges inside', () => {
    expect(missedShare([1, 5, 9, NaN], [2, 5, 0, 0], [4, 6, 8, 10])).toBeCloseTo(2 / 3, 12);
    expect(missedShare([1], [NaN], [2])).toBeNaN();
  });
});
