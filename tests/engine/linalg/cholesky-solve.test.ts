import { describe, expect, it } from 'vitest';
import { choleskySolve } from '../../../src/engine/linalg/cholesky-solve';
import fixture from '../../reference/fixtures/cholesky-numpy.json';

const flat = (rows: number[][]) => Float64Array.from(rows.flat());

describe('choleskySolve(a, b, p, m)', () => {
  it('solves a 4 x 4 SPD system with two right-hand sides like numpy.linalg.solve and scipy.linalg.cho_solve', () => {
    // reference: cholesky-numpy.json (numpy 1.24.2, scipy 1.10.1; call and script in README-engine-fixtures.md)
    const x = choleskySolve(flat(fixture.a), flat(fixture.b), 4, 2)!;
    const expected = fixture.solve.flat();
    const cho = fixture.choSolve.flat();
    expect(x).toHaveLength(8);
    x.forEach((v, i) => {
      expect(v).toBeCloseTo(expected[i], 12);
      expect(v).toBeCloseTo(cho[i], 12);
    });
  });

  it('gives the exact solution of the 3 x 3 example whose factor is L = [[2,0,0],[6,1,0],[-8,5,3]]', () => {
    // from memory: the worked example of the Cholesky decomposition article of Wikipedia,
    // A = [[4,12,-16],[12,37,-43],[-16,-43,98]] = L Lᵀ; b = A·(1, -2, 3)
    const a = Float64Array.of(4, 12, -16, 12, 37, -43, -16, -43, 98);
    const b = Float64Array.of(4 - 24 - 48, 12 - 74 - 129, -16 + 86 + 294);
    expect(Array.from(choleskySolve(a, b, 3, 1)!)).toEqual([1, -2, 3]);
  });

  it('reproduces its doc example', () => {
    expect(Array.from(choleskySolve(Float64Array.of(4, 2, 2, 3), Float64Array.of(2, 1), 2, 1)!)).toEqual([0.5, 0]);
  });

  it('reads only the lower triangle of a', () => {
    // the gram sums (gram.ts) fill only j <= i
    const full = choleskySolve(flat(fixture.a), flat(fixture.b), 4, 2)!;
    const lower = flat(fixture.a.map((row, i) => row.map((v, j) => (j <= i ? v : 999))));
    expect(Array.from(choleskySolve(lower, flat(fixture.b), 4, 2)!)).toEqual(Array.from(full));
  });

  it('leaves b untouched', () => {
    const b = flat(fixture.b);
    choleskySolve(flat(fixture.a), b, 4, 2);
    expect(Array.from(b)).toEqual(fixture.b.flat());
  });

  it.each([
    ['indefinite', [1, 2, 2, 1]],
    ['singular', [1, 1, 1, 1]],
    ['zero', [0, 0, 0, 0]],
    ['with NaN', [NaN, 0, 0, 1]],
  ])('returns undefined for a %s matrix', (_what, a) => {
    expect(choleskySolve(Float64Array.from(a), Float64Array.of(1, 1), 2, 1)).toBeUndefined();
  });
});
