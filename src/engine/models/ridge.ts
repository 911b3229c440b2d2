import { InputError } from '../errors';
import { choleskySolve } from '../linalg/cholesky-solve';
import { addRow, emptyGram, type Gram } from '../linalg/gram';
import { standardise, type Standardiser } from './standardiser';

/**
 * Ridge regression (Hoerl & Kennard 1970) of all slots of a day on one
 * shared feature vector: one factorisation serves every slot. Features are
 * standardised; the intercept (last coefficient row) is not penalised.
 * Sums are kept (gram.ts) so the model can take new days cheaply.
 */
export function ridgeRow(x: Float64Array, s: Standardiser): Float64Array {
  const z = standardise(x, s);
  const row = new Float64Array(z.length + 1);
  row.set(z);
  row[z.length] = 1;
  return row;
}

export function ridgeGram(xs: Float64Array[], ys: Float64Array[], s: Standardiser): Gram {
  const g = emptyGram(xs[0].length + 1, ys[0].length);
  for (let i = 0; i < xs.length; i++) addRidgeDay(g, s, xs[i], ys[i]);
  return g;
}

/** Solves for the coefficients at penalty λ (scaled by the row count, so λ means the same for any span). */
export function solveRidge(g: Gram, lambda: number): Float64Array {
  const { p, m, xtx, xty } = g;
  const a = new Float64Array(p * p);
  for (let i = 0; i < p; i++) for (let j = 0; j <= i; j++) { a[i * p + j] = xtx[i * p + j]; a[j * p + i] = xtx[i * p + j]; }
  const penalty = lambda * g.rows;
  for (let i = 0; i < p - 1; i++) a[i * p + i] += penalty;
  a[(p - 1) * p + (p - 1)] += 1e-9 * g.rows;
  const w = choleskySolve(a, xty, p, m);
  if (!w) throw new InputError('the linear model could not be fitted: its inputs are degenerate (e.g. a constant price history)');
  // 32-bit coefficients: far finer than any price, and the model file stores them exactly in half the space
  return w.map(Math.fround);
}

/** Adds one day to the sums of a ridge model; weight −1 takes it out again. */
export function addRidgeDay(gram: Gram, s: Standardiser, x: Float64Array, y: Float64Array, weight: 1 | -1 = 1): void {
  addRow(gram, ridgeRow(x, s), y, weight);
}

export function predictRidge(weights: Float64Array, s: Standardiser, x: Float64Array, m: number): Float64Array {
  const row = ridgeRow(x, s);
  const out = new Float64Array(m);
  for (let i = 0; i < row.length; i++) {
    const v = row[i];
    if (v === 0) continue;
    for (let c = 0; c < m; c++) out[c] += v * weights[i * m + c];
  }
  return out;
}
