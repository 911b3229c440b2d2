import { describe, expect, test } from 'vitest';
import { studentTCdf } from '../../../src/engine/compare/student-t-cdf';

// Closed forms of the t distribution function for small degrees of freedom
// (Abramowitz & Stegun, Handbook of Mathematical Functions, 26.7.3, quoted from memory):
// df = 1 (Cauchy): 1/2 + atan(x)/pi; df = 2: 1/2 + x / (2 sqrt(2 + x^2));
// df = 3: 1/2 + (θ + sinθ cosθ)/pi with θ = atan(x/sqrt(3)).
const cauchy = (x: number) => 0.5 + Math.atan(x) / Math.PI;
const t2 = (x: number) => 0.5 + x / (2 * Math.sqrt(2 + x * x));
const t3 = (x: number) => {
  const th = Math.atan(x / Math.sqrt(3));
  return 0.5 + (th + Math.sin(th) * Math.cos(th)) / Math.PI;
};

describe('studentTCdf(x, df)', () => {
  test.each([-6, -1.5, -0.2, 0.7, 3])('matches the closed forms for df 1, 2, 3 at x = %d', (x) => {
    expect(studentTCdf(x, 1)).toBeCloseTo(cauchy(x), 7);
    expect(studentTCdf(x, 2)).toBeCloseTo(t2(x), 7);
    expect(studentTCdf(x, 3)).toBeCloseTo(t3(x), 7);
  });

  test('is symmetric about 0', () => {
    for (const df of [1, 4, 13, 100]) {
      expect(studentTCdf(-1.3, df) + studentTCdf(1.3, df)).toBeCloseTo(1, 7);
      expect(studentTCdf(0, df)).toBeCloseTo(0.5, 7);
    }
  });

  test('gives exactly 0 and 1 at -Infinity and Infinity', () => {
    expect(studentTCdf(-Infinity, 5)).toBe(0);
    expect(studentTCdf(Infinity, 5)).toBe(1);
  });
});
