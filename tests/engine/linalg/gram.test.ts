import { describe, expect, it } from 'vitest';
import { addRow, emptyGram } from '../../../src/engine/linalg/gram';

describe('emptyGram(p, m)', () => {
  it('holds zero sums of the right sizes', () => {
    const g = emptyGram(3, 2);
    expect(g).toMatchObject({ p: 3, m: 2, rows: 0 });
    expect(Array.from(g.xtx)).toEqual(new Array(9).fill(0));
    expect(Array.from(g.xty)).toEqual(new Array(6).fill(0));
  });
});

describe('addRow(g, x, y, weight)', () => {
  // X = [[1, 2], [3, 4], [0, -1]], Y = [[1, 0], [2, 5], [7, 1]] worked by hand (common practice: XᵀX = Σ xᵢxᵢᵀ, XᵀY = Σ xᵢyᵢᵀ):
  // XᵀX = [[10, 14], [14, 21]], XᵀY = [[7, 15], [3, 19]]
  const rows = [[1, 2], [3, 4], [0, -1]];
  const targets = [[1, 0], [2, 5], [7, 1]];

  it('sums XᵀX (lower triangle) and XᵀY row by row', () => {
    const g = emptyGram(2, 2);
    rows.forEach((x, i) => addRow(g, x, targets[i]));
    expect(g.rows).toBe(3);
    expect(g.xtx[0]).toBe(10);
    expect(g.xtx[2]).toBe(14); // (1, 0)
    expect(g.xtx[3]).toBe(21);
    expect(g.xtx[1]).toBe(0); // the upper triangle is left to the solver
    expect(Array.from(g.xty)).toEqual([7, 15, 3, 19]);
  });

  it('weight -1 takes a row out again', () => {
    const g = emptyGram(2, 2);
    rows.forEach((x, i) => addRow(g, x, targets[i]));
    addRow(g, rows[1], targets[1], -1);
    const h = emptyGram(2, 2);
    addRow(h, rows[0], targets[0]);
    addRow(h, rows[2], targets[2]);
    expect(g.rows).toBe(2);
    expect(Array.from(g.xtx)).toEqual(Array.from(h.xtx));
    expect(Array.from(g.xty)).toEqual(Array.from(h.xty));
  });

  it('matches a direct double loop over a larger random X', () => {
    const p = 5, m = 3, n = 30;
    let seed = 11;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5;
    const xs = Array.from({ length: n }, () => Array.from({ length: p }, rand));
    const ys = Array.from({ length: n }, () => Array.from({ length: m }, rand));
    const g = emptyGram(p, m);
    xs.forEach((x, i) => addRow(g, x, ys[i]));
    for (let i = 0; i < p; i++) {
      for (let j = 0; j <= i; j++) expect(g.xtx[i * p + j]).toBeCloseTo(xs.reduce((s, x) => s + x[i] * x[j], 0), 12);
      for (let c = 0; c < m; c++) expect(g.xty[i * m + c]).toBeCloseTo(xs.reduce((s, x, k) => s + x[i] * ys[k][c], 0), 12);
    }
  });
});
