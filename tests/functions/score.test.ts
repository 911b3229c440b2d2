import { describe, expect, it } from 'vitest';
import { score } from '../../src/functions/score';

const actual = [[10], [20], [''], [40]];
const forecast = [[12], [17], [99], [40]];

describe('score', () => {
  it('score(actual, forecast) is the MAE over the pairs whose cells are both filled', () => {
    // by hand: |12-10| + |17-20| + |40-40| = 5 over 3 pairs (the empty actual is skipped)
    expect(score(actual, forecast, null, null)).toBeCloseTo(5 / 3, 12);
  });

  it('score takes metric names in any case', () => {
    // RMSE by hand: sqrt((4 + 9 + 0) / 3); bias (mean of forecast - actual): (2 - 3 + 0) / 3
    expect(score(actual, forecast, 'rmse', null)).toBeCloseTo(Math.sqrt(13 / 3), 12);
    expect(score(actual, forecast, 'Bias', null)).toBeCloseTo(-1 / 3, 12);
  });

  it('score(..., "RMAE", reference) divides by the reference forecast\'s MAE', () => {
    // reference MAE by hand: (5 + 5 + 0) / 3
    expect(score(actual, forecast, 'RMAE', [[15], [25], [0], [40]])).toBeCloseTo(5 / 10, 12);
    expect(() => score(actual, forecast, 'RMAE', null)).toThrow(/RMAE needs the reference forecast/);
  });

  it('score(..., "MASE", season) scales by the in-sample seasonal naive MAE', () => {
    // season 1 on actual 10, 20, 40 (the empty cell breaks the pairs 20→'' and ''→40): scale = |20-10| = 10
    expect(score(actual, forecast, 'MASE', [[1]])).toBeCloseTo(5 / 3 / 10, 12);
    expect(() => score(actual, forecast, 'MASE', 1.5)).toThrow(/whole number of periods/);
  });

  it('score(..., "PINBALL", tau) needs the quantile level', () => {
    // pinball at tau = 0.1 by hand: actual above forecast costs tau × gap, below costs (1 - tau) × gap:
    // (0.9 × 2 + 0.1 × 3 + 0) / 3
    expect(score(actual, forecast, 'PINBALL', 0.1)).toBeCloseTo((0.9 * 2 + 0.1 * 3) / 3, 12);
    expect(() => score(actual, forecast, 'PINBALL', null)).toThrow(/PINBALL needs the quantile level/);
  });

  it('score refuses unknown metrics, extra arguments, text and different sizes', () => {
    expect(() => score(actual, forecast, 'R2', null)).toThrow(/unknown metric "R2"; use one of MAE, RMSE/);
    expect(() => score(actual, forecast, 'MAE', 3)).toThrow(/MAE takes no 4th argument/);
    expect(() => score([[1], ['x']], [[1], [2]], null, null)).toThrow(/row 2, column "actual": "x" is not a number/);
    expect(() => score([[1]], [[1], [2]], null, null)).toThrow(/actual has 1 cells but forecast has 2/);
  });

  it('score with no complete pair is an error, not a number', () => {
    expect(() => score([[''], ['']], [[1], [2]], null, null)).toThrow();
  });
});
