import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { fromScaled } from '../../../src/engine/features/level-scale';
import { RIDGE_LAMBDAS } from '../../../src/engine/models/learner-settings';
import {
  advanceMember, chooseLinearMembers, LINEAR_WINDOWS, refitLinearMembers, linearPrice, windowOf, type LinearMember, type MemberSums,
} from '../../../src/engine/models/linear-ensemble';
import { predictRidge, ridgeGram, solveRidge } from '../../../src/engine/models/ridge';
import { fitStandardiser, type Standardiser } from '../../../src/engine/models/standardiser';
import type { TrainingDay } from '../../../src/engine/models/training-days';

const p = 4, m = 3;

/** Days with y = B·x + noise on a unit level scale; `noise` 0 gives an exact linear relation. */
function days(n: number, noise = 0.05, seed = 'ens'): TrainingDay[] {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, (_, day) => {
    const x = Float64Array.from({ length: p }, () => 2 * rng() - 1);
    const y = Float64Array.from({ length: m }, (_, c) => 0.5 * x[0] - 0.3 * x[1] * (c + 1) + 0.2 * x[3] + 0.1 + noise * (rng() - 0.5));
    return { day, x, y, scale: { centre: 40 + day / 10, scale: 8 } };
  });
}

const mae = (ds: TrainingDay[]) => (preds: Float64Array[]) => {
  let sum = 0;
  ds.forEach((d, i) => d.y!.forEach((z, c) => { sum += Math.abs(fromScaled(z, d.scale) - preds[i][c]); }));
  return sum / (ds.length * m);
};

/** within one float32 rounding step: the weights are stored as float32 (ridge.ts) */
function expectFloat32Close(a: Float64Array, b: Float64Array) {
  expect(a).toHaveLength(b.length);
  a.forEach((v, i) => expect(Math.abs(v - b[i])).toBeLessThanOrEqual(2 ** -22 * Math.max(Math.abs(v), Math.abs(b[i])) + 1e-12));
}

function expectSumsClose(a: MemberSums, b: MemberSums) {
  expect(a.gram.rows).toBe(b.gram.rows);
  expect(a.days.map((d) => d.day)).toEqual(b.days.map((d) => d.day));
  a.gram.xtx.forEach((v, i) => expect(Math.abs(v - b.gram.xtx[i])).toBeLessThan(1e-9 * Math.max(1, Math.abs(v))));
  a.gram.xty.forEach((v, i) => expect(Math.abs(v - b.gram.xty[i])).toBeLessThan(1e-9 * Math.max(1, Math.abs(v))));
}

describe('windowOf(days, window)', () => {
  it('keeps the last W days; 0 keeps all', () => {
    const ds = days(10);
    expect(windowOf(ds, 3).map((d) => d.day)).toEqual([7, 8, 9]);
    expect(windowOf(ds, 0)).toBe(ds);
    expect(windowOf(ds, 50)).toHaveLength(10);
  });
});

describe('advanceMember(member, sums, fresh, s)', () => {
  const all = days(60);
  const s: Standardiser = fitStandardiser(all.slice(0, 30).map((d) => d.x));
  const start = (window: number, upTo: number): { member: LinearMember; sums: MemberSums } => {
    const part = windowOf(all.slice(0, upTo), window);
    const gram = ridgeGram(part.map((d) => d.x), part.map((d) => d.y!), s);
    return { member: { window, lambda: 0.01, weights: solveRidge(gram, 0.01) }, sums: { gram, days: [...part] } };
  };

  it.each([[20], [0]])('with window %d: after adding days the weights equal a fresh fit on the window', (window) => {
    const { member, sums } = start(window, 30);
    advanceMember(member, sums, all.slice(30, 37), s);
    advanceMember(member, sums, all.slice(37, 38), s);
    advanceMember(member, sums, all.slice(38, 55), s);
    const fresh = start(window, 55);
    expectSumsClose(sums, fresh.sums);
    expectFloat32Close(member.weights, fresh.member.weights);
    if (window > 0) expect(sums.days.map((d) => d.day)).toEqual(Array.from({ length: window }, (_, k) => 55 - window + k));
  });

  it('with no fresh days keeps the fit', () => {
    const { member, sums } = start(20, 30);
    const before = Float64Array.from(member.weights);
    advanceMember(member, sums, [], s);
    expect(Array.from(member.weights)).toEqual(Array.from(before));
  });
});

const noBounds = { lo: new Float64Array(m).fill(-Infinity), hi: new Float64Array(m).fill(Infinity) };

describe('chooseLinearMembers(days, s, m, bounds, totalDays)', () => {
  it('fits one member on the expanding window when the history is shorter than a year', () => {
    const all = days(80);
    const s = fitStandardiser(all.map((d) => d.x));
    const chosen = chooseLinearMembers(all, s, m, noBounds);
    expect(chosen.map((x) => x.window)).toEqual([0]);
    expectFloat32Close(chosen[0].weights, solveRidge(ridgeGram(all.map((d) => d.x), all.map((d) => d.y!), s), chosen[0].lambda));
  });

  it('keeps a one-year member when the days it is refitted on exceed a year', () => {
    const all = days(400), some = all.slice(0, 350);
    const s = fitStandardiser(some.map((d) => d.x));
    expect(chooseLinearMembers(some, s, m, noBounds).map((x) => x.window)).toEqual([0]);
    expect(chooseLinearMembers(some, s, m, noBounds, all.length).map((x) => x.window)).toEqual(LINEAR_WINDOWS);
    expect(refitLinearMembers(chooseLinearMembers(some, s, m, noBounds, all.length), all, s).sums[1].days).toHaveLength(364);
  });

  it('chooses the penalty with the lowest MAE over five contiguous folds, each forecast by a fit on the other days', () => {
    const all = days(120, 1.5);
    const s = fitStandardiser(all.map((d) => d.x));
    // the folds by hand: days 0-23, 24-47, 48-71, 72-95, 96-119, each fitted from scratch on the rest
    const cvError = (lambda: number) => {
      let sum = 0;
      for (let f = 0; f < 5; f++) {
        const held = all.slice(24 * f, 24 * (f + 1));
        const rest = all.filter((_, i) => i < 24 * f || i >= 24 * (f + 1));
        const weights = solveRidge(ridgeGram(rest.map((d) => d.x), rest.map((d) => d.y!), s), lambda);
        sum += mae(held)(held.map((d) => linearPrice([{ window: 0, lambda, weights }], s, d.x, m, d.scale))) * held.length * m;
      }
      return sum;
    };
    const errors = RIDGE_LAMBDAS.map(cvError);
    const [member] = chooseLinearMembers(all, s, m, noBounds);
    expect(member.lambda).toBe(RIDGE_LAMBDAS[errors.indexOf(Math.min(...errors))]);
  });

  it('picks the smallest penalty on noiseless linear data and then reproduces it closely', () => {
    const all = days(80, 0);
    const s = fitStandardiser(all.map((d) => d.x));
    const members = chooseLinearMembers(all, s, m, noBounds);
    expect(members[0].lambda).toBe(RIDGE_LAMBDAS[0]);
    expect(mae(all)(all.map((d) => linearPrice(members, s, d.x, m, d.scale)))).toBeLessThan(0.01);
  });
});

describe('refitLinearMembers(chosen, days, s)', () => {
  it('fits each chosen window and penalty again on the days given, with their sums', () => {
    const all = days(420, 1.5);
    const s = fitStandardiser(all.map((d) => d.x));
    const chosen = chooseLinearMembers(all.slice(0, 380), s, m, noBounds, all.length);
    const { members, sums } = refitLinearMembers(chosen, all, s);
    members.forEach((member, k) => {
      expect(member.lambda).toBe(chosen[k].lambda);
      const full = windowOf(all, member.window);
      expectFloat32Close(member.weights, solveRidge(ridgeGram(full.map((d) => d.x), full.map((d) => d.y!), s), member.lambda));
      expect(sums[k].days.map((d) => d.day)).toEqual(full.map((d) => d.day));
    });
  });
});

describe('linearPrice(members, s, x, m, scale)', () => {
  it('averages the members in price units (after the inverse of the level scale)', () => {
    const all = days(40);
    const s = fitStandardiser(all.map((d) => d.x));
    const g = ridgeGram(all.map((d) => d.x), all.map((d) => d.y!), s);
    const a: LinearMember = { window: 0, lambda: 0.001, weights: solveRidge(g, 0.001) };
    const b: LinearMember = { window: 0, lambda: 3, weights: solveRidge(g, 3) };
    const d = all[5];
    const za = predictRidge(a.weights, s, d.x, m), zb = predictRidge(b.weights, s, d.x, m);
    const both = linearPrice([a, b], s, d.x, m, d.scale);
    for (let c = 0; c < m; c++) expect(both[c]).toBeCloseTo((fromScaled(za[c], d.scale) + fromScaled(zb[c], d.scale)) / 2, 10);
  });
});
