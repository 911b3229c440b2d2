import { describe, expect, it } from 'vitest';
import { ActiveCholesky } from '../../../src/engine/linalg/lars-cholesky';
import fixture from '../../reference/fixtures/cholesky-numpy.json';

// reference: cholesky-numpy.json (numpy 1.24.2 numpy.linalg.cholesky and solve; script in README-engine-fixtures.md)
const A = fixture.a;

function factorOf(cols: number[]): ActiveCholesky {
  const f = new ActiveCholesky(4);
  cols.forEach((j, k) => expect(f.add(A[j][j], cols.slice(0, k).map((i) => A[j][i]), 1e-10)).toBe(true));
  return f;
}

function expectFactors(f: ActiveCholesky, cols: number[]) {
  // L is lower triangular with a positive diagonal and L Lᵀ is A on those columns
  cols.forEach((ci, i) => {
    expect(f.at(i, i)).toBeGreaterThan(0);
    for (let j = i + 1; j < cols.length; j++) expect(f.at(i, j)).toBe(0);
    cols.forEach((cj, j) => {
      let s = 0;
      for (let t = 0; t < cols.length; t++) s += f.at(i, t) * f.at(j, t);
      expect(s).toBeCloseTo(A[ci][cj], 12);
    });
  });
}

describe('ActiveCholesky', () => {
  it('add() column by column gives numpy.linalg.cholesky(A)', () => {
    const f = factorOf([0, 1, 2, 3]);
    fixture.cholesky.forEach((row, i) => row.forEach((v, j) => expect(f.at(i, j)).toBeCloseTo(v, 12)));
  });

  it('solve() gives numpy.linalg.solve(A, b)', () => {
    const f = factorOf([0, 1, 2, 3]);
    for (let m = 0; m < 2; m++) {
      const u = f.solve(fixture.b.map((r) => r[m]));
      u.forEach((v, i) => expect(v).toBeCloseTo(fixture.solve[i][m], 12));
    }
  });

  it.each([0, 1, 2, 3])('remove(%i) leaves the factor of the other three columns', (q) => {
    const f = factorOf([0, 1, 2, 3]);
    f.remove(q);
    expect(f.size).toBe(3);
    const rest = [0, 1, 2, 3].filter((j) => j !== q);
    expectFactors(f, rest);
    // and it grows again as if built afresh
    expect(f.add(A[q][q], rest.map((i) => A[q][i]), 1e-10)).toBe(true);
    expectFactors(f, [...rest, q]);
  });

  it('refuses a column in the span of the active ones and keeps the factor as it was', () => {
    // column 3 written as column 0 + 2 × column 1 (its Gram entries follow from A)
    const f = factorOf([0, 1]);
    const g = (i: number) => A[0][i] + 2 * A[1][i];
    const gjj = g(0) + 2 * g(1);
    expect(f.add(gjj, [g(0), g(1)], 1e-10)).toBe(false);
    expect(f.size).toBe(2);
    expectFactors(f, [0, 1]);
    expect(f.add(0, [0, 0], 1e-10)).toBe(false); // a zero column
    // spans() asks the same without changing the factor
    expect(f.spans(gjj, [g(0), g(1)], 1e-10)).toBe(true);
    expect(f.spans(A[2][2], [A[2][0], A[2][1]], 1e-10)).toBe(false);
    expect(f.size).toBe(2);
    expectFactors(f, [0, 1]);
  });

  it('reproduces its doc example', () => {
    const f = new ActiveCholesky(3);
    f.add(4, [], 1e-10);
    f.add(3, [2], 1e-10);
    expect([f.at(0, 0), f.at(1, 0), f.at(1, 1)]).toEqual([2, 1, Math.SQRT2]);
    expect(Array.from(f.solve(Float64Array.of(2, 1)))).toEqual([0.5, 0]);
  });
});
