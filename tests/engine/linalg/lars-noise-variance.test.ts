import { describe, expect, it } from 'vitest';
import { olsNoiseVariance, projectionRss } from '../../../src/engine/linalg/lars-noise-variance';
import fx from '../../reference/fixtures/lars-diabetes.json';

// The diabetes columns (lars-diabetes.json) are centred; the scikit-learn value is checked in
// tests/reference/lars-sklearn.test.ts, these are properties of the least-squares residual.
function gramOf(x: number[][], y: number[]) {
  const p = x[0].length;
  const gram = new Float64Array(p * p), xty = new Float64Array(p);
  let yty = 0;
  for (const [r, row] of x.entries()) {
    yty += y[r] * y[r];
    for (let i = 0; i < p; i++) {
      xty[i] += row[i] * y[r];
      for (let j = 0; j < p; j++) gram[i * p + j] += row[i] * row[j];
    }
  }
  return { gram, xty, yty };
}
const ym = fx.y.reduce((s, v) => s + v, 0) / fx.y.length;
const y = fx.y.map((v) => v - ym);

describe('olsNoiseVariance(gram, xtys, ytys, p, n)', () => {
  it('reproduces its doc example', () => {
    expect(olsNoiseVariance(Float64Array.of(2), [Float64Array.of(2)], [3], 1, 4)![0]).toBeCloseTo(0.5, 15);
  });

  it('takes the residual of the projection when a column repeats (a rank-deficient X), dividing by n − p − 1 with all p', () => {
    const once = gramOf(fx.x, y), twice = gramOf(fx.x.map((r) => [...r, r[3]]), y);
    const a = projectionRss(once.gram, [once.xty], [once.yty], 10)[0];
    const b = projectionRss(twice.gram, [twice.xty], [twice.yty], 11)[0];
    expect(b).toBeCloseTo(a, 6);
    expect(olsNoiseVariance(twice.gram, [twice.xty], [twice.yty], 11, 442)![0]).toBeCloseTo(b / (442 - 12), 8);
  });

  it('serves several targets from one factorisation', () => {
    const g = gramOf(fx.x, y);
    const y2 = y.map((v, i) => v * 0.5 + fx.x[i][0] * 100);
    const g2 = gramOf(fx.x, y2);
    const both = olsNoiseVariance(g.gram, [g.xty, g2.xty], [g.yty, g2.yty], 10, 442)!;
    expect(both[0]).toBe(olsNoiseVariance(g.gram, [g.xty], [g.yty], 10, 442)![0]);
    expect(both[1]).toBeCloseTo(both[0] / 4, 6); // scaling y by ½ and adding a column of X scales the residual by ½
  });

  it('is undefined without degrees of freedom left (n ≤ p + 1)', () => {
    const g = gramOf(fx.x.slice(0, 11), y.slice(0, 11));
    expect(olsNoiseVariance(g.gram, [g.xty], [g.yty], 10, 11)).toBeUndefined();
    expect(olsNoiseVariance(g.gram, [g.xty], [g.yty], 10, 12)).toBeDefined();
  });
});
