import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { exactShapley, InputError } from '../../../src/engine';

const scalar = (f: (mask: number) => number) => (mask: number) => Float64Array.of(f(mask));
const has = (mask: number, i: number) => (mask & (1 << i)) !== 0;

/** Shapley's definition as the average marginal contribution over all G! orders of joining (an independent route to the same numbers). */
function byOrders(players: number, v: (mask: number) => number): number[] {
  const phi = new Array(players).fill(0);
  const orders: number[][] = [];
  const permute = (rest: number[], acc: number[]) => {
    if (rest.length === 0) { orders.push(acc); return; }
    rest.forEach((p, k) => permute([...rest.slice(0, k), ...rest.slice(k + 1)], [...acc, p]));
  };
  permute([...Array(players).keys()], []);
  for (const order of orders) {
    let mask = 0;
    for (const p of order) { phi[p] += (v(mask | (1 << p)) - v(mask)) / orders.length; mask |= 1 << p; }
  }
  return phi;
}

describe('exactShapley(players, value)', () => {
  it('gives the glove game its textbook values 2/3, 1/6, 1/6', () => {
    // glove game: player 0 holds a left glove, players 1 and 2 a right one; a pair is worth 1.
    // Values 2/3, 1/6, 1/6: the standard worked example (e.g. Wikipedia, "Shapley value", glove game; from memory)
    const v = scalar((m) => (has(m, 0) && (has(m, 1) || has(m, 2)) ? 1 : 0));
    const phi = exactShapley(3, v).map((p) => p[0]);
    expect(phi[0]).toBeCloseTo(2 / 3, 15);
    expect(phi[1]).toBeCloseTo(1 / 6, 15);
    expect(phi[2]).toBeCloseTo(1 / 6, 15);
  });

  it('agrees with the average over all orders of joining on a seeded random 5-player game', () => {
    const rng = seedrandom('shapley-orders');
    const table = Array.from({ length: 32 }, () => 100 * (rng() - 0.5));
    const phi = exactShapley(5, scalar((m) => table[m])).map((p) => p[0]);
    const reference = byOrders(5, (m) => table[m]);
    phi.forEach((p, i) => expect(p).toBeCloseTo(reference[i], 10));
  });

  it('is efficient: the values add up to v(N) − v(∅) in every component', () => {
    const rng = seedrandom('shapley-efficiency');
    const table = Array.from({ length: 256 }, () => Float64Array.from({ length: 24 }, () => 80 + 40 * rng()));
    const phi = exactShapley(8, (m) => table[m]);
    for (let s = 0; s < 24; s++) {
      const sum = phi.reduce((a, p) => a + p[s], 0);
      const change = table[255][s] - table[0][s];
      expect(Math.abs(sum - change)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(change)));
    }
  });

  it('gives a null player exactly 0 and an additive game its own terms', () => {
    const rng = seedrandom('shapley-null');
    const table = Array.from({ length: 16 }, () => rng());
    // player 2 never changes the value: v(S) depends on S without bit 2
    const phi = exactShapley(4, scalar((m) => table[m & ~4])).map((p) => p[0]);
    expect(phi[2]).toBe(0);
    const a = [3, -1.5, 0.25];
    const additive = exactShapley(3, scalar((m) => a.reduce((s, ai, i) => s + (has(m, i) ? ai : 0), 10))).map((p) => p[0]);
    additive.forEach((p, i) => expect(p).toBeCloseTo(a[i], 14));
  });

  it('handles one player and refuses more than 16', () => {
    expect(Array.from(exactShapley(1, scalar((m) => 5 + 2 * m))[0])).toEqual([2]);
    expect(() => exactShapley(17, scalar(() => 0))).toThrow(InputError);
  });
});
