import { describe, expect, it } from 'vitest';
import { DEFAULT_NETWORK_OPTIONS, NetworkOptionsSchema } from '../../../src/engine';
import { loadNetwork, trainNetwork, type Sample } from '../../../src/engine/models/network';

// y = 0.5 + 0.3 sin(2πx) on [0, 1]: a smooth function that one hidden sigmoid
// layer can approximate (Cybenko 1989, universal approximation).
const target = (x: number) => 0.5 + 0.3 * Math.sin(2 * Math.PI * x);
const samples: Sample[] = Array.from({ length: 64 }, (_, i) => {
  const x = i / 63;
  return { input: Float64Array.of(x), output: Float64Array.of(target(x)) };
});
const grid = Array.from({ length: 101 }, (_, i) => i / 100);
const maeOf = (run: (x: Float64Array) => Float64Array) => grid.reduce((s, x) => s + Math.abs(run(Float64Array.of(x))[0] - target(x)), 0) / grid.length;

describe('trainNetwork(samples, options, seed, validationLoss)', () => {
  it('learns 0.5 + 0.3 sin(2πx) to within 0.02 mean absolute error', () => {
    const options = { ...DEFAULT_NETWORK_OPTIONS, hiddenLayers: [12], learningRate: 0.3, momentum: 0.5, iterations: 3000, checkEvery: 100, patience: 30 };
    const { json } = trainNetwork(samples, options, 1, maeOf);
    expect(maeOf(loadNetwork(json))).toBeLessThan(0.02);
  });

  it('momentum 0.9 converges faster than momentum 0 at the same small learning rate (heavy-ball step ≈ lr / (1 − m); Qian 1999)', () => {
    const base = { ...DEFAULT_NETWORK_OPTIONS, hiddenLayers: [8], learningRate: 0.02, iterations: 300, checkEvery: 300, patience: 5 };
    const without = trainNetwork(samples, { ...base, momentum: 0 }, 7, maeOf).report.validationLoss.at(-1)!;
    const withMomentum = trainNetwork(samples, { ...base, momentum: 0.9 }, 7, maeOf).report.validationLoss.at(-1)!;
    expect(withMomentum).toBeLessThan(without * 0.7);
  });

  it('is bit-identical for the same seed and differs for another seed', () => {
    const options = { ...DEFAULT_NETWORK_OPTIONS, hiddenLayers: [6], iterations: 20, checkEvery: 10 };
    const a = trainNetwork(samples, options, 5, maeOf).json;
    const b = trainNetwork(samples, options, 5, maeOf).json;
    const c = trainNetwork(samples, options, 6, maeOf).json;
    expect(b).toEqual(a);
    expect(c).not.toEqual(a);
  });

  it('restores the weights of the best validation check (early stopping)', () => {
    const options = { ...DEFAULT_NETWORK_OPTIONS, hiddenLayers: [6], learningRate: 0.3, iterations: 200, checkEvery: 10, patience: 3 };
    const { json, report } = trainNetwork(samples, options, 2, maeOf);
    const best = Math.min(...report.validationLoss);
    expect(maeOf(loadNetwork(json))).toBeCloseTo(best, 6);
  });
});

describe('NetworkOptionsSchema', () => {
  it.each([
    [{ learningRate: 0 }, /learning rate must be above 0/],
    [{ learningRate: 1.5 }, /learning rate must be at most 1/],
    [{ momentum: 1 }, /momentum must be below 1/],
    [{ momentum: -0.1 }, /momentum must be at least 0/],
    [{ hiddenLayers: [] }, /at least one hidden layer/],
    [{ iterations: 0 }, /iterations must be at least 1/],
  ])('refuses %o with a plain message', (change, message) => {
    const r = NetworkOptionsSchema.safeParse({ ...DEFAULT_NETWORK_OPTIONS, ...change });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toMatch(message);
  });
});
