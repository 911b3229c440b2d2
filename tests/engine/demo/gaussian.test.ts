import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { gaussianSource } from '../../../src/engine/demo/gaussian';

describe('gaussianSource(random)', () => {
  const draws = (seed: string, n: number) => {
    const normal = gaussianSource(seedrandom.alea(seed));
    return Array.from({ length: n }, () => normal());
  };

  it('gives mean ≈ 0 and standard deviation ≈ 1', () => {
    const x = draws('a', 200_000);
    const mean = x.reduce((s, v) => s + v, 0) / x.length;
    const sd = Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / (x.length - 1));
    // Standard error of the mean is 1/sqrt(200000) ≈ 0.0022; allow about 5 of them.
    expect(Math.abs(mean)).toBeLessThan(0.012);
    expect(Math.abs(sd - 1)).toBeLessThan(0.01);
  });

  it('puts about 95 % of draws within ±1.96 and 68.3 % within ±1 (normal table, common knowledge)', () => {
    const x = draws('b', 200_000);
    expect(x.filter((v) => Math.abs(v) < 1.96).length / x.length).toBeCloseTo(0.95, 2);
    expect(x.filter((v) => Math.abs(v) < 1).length / x.length).toBeCloseTo(0.6827, 2);
  });

  it('repeats for the same seed and differs for another', () => {
    expect(draws('s', 50)).toEqual(draws('s', 50));
    expect(draws('s', 50)).not.toEqual(draws('t', 50));
  });

  it('stays finite even when the uniform source returns 0', () => {
    const normal = gaussianSource(() => 0);
    expect(Number.isFinite(normal())).toBe(true);
    expect(Number.isFinite(normal())).toBe(true);
  });
});
