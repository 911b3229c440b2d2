/**
 * Column means and standard deviations of the training rows; a constant
 * column gets sd 1 so it maps to 0 instead of dividing by zero.
 */
export interface Standardiser {
  mean: Float64Array;
  sd: Float64Array;
}

export function fitStandardiser(rows: Float64Array[]): Standardiser {
  const p = rows[0].length;
  const mean = new Float64Array(p);
  const sd = new Float64Array(p);
  for (const r of rows) for (let j = 0; j < p; j++) mean[j] += r[j];
  for (let j = 0; j < p; j++) mean[j] /= rows.length;
  for (const r of rows) for (let j = 0; j < p; j++) sd[j] += (r[j] - mean[j]) ** 2;
  for (let j = 0; j < p; j++) {
    const s = Math.sqrt(sd[j] / rows.length);
    sd[j] = s > 1e-9 ? s : 1;
  }
  return { mean, sd };
}

export function standardise(x: Float64Array, s: Standardiser): Float64Array {
  const out = new Float64Array(x.length);
  for (let j = 0; j < x.length; j++) out[j] = (x[j] - s.mean[j]) / s.sd[j];
  return out;
}
