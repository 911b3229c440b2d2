/**
 * Weighted mix of two forecasts per day, `wa` on the first; and the weight
 * (a grid of 0.05 steps) whose mix scores best, the earliest on a tie.
 */
export function mix(a: Float64Array[], b: Float64Array[], wa: number): Float64Array[] {
  if (wa === 0 || a.length === 0) return b;
  if (wa === 1) return a;
  return a.map((row, i) => row.map((v, k) => wa * v + (1 - wa) * b[i][k]));
}

export function bestMixWeight(a: Float64Array[], b: Float64Array[], score: (preds: Float64Array[]) => number): number {
  let best = Infinity, weight = 0;
  for (let step = 0; step <= 20; step++) {
    const w = step / 20;
    const e = score(mix(a, b, w));
    if (e < best - 1e-12) { best = e; weight = w; }
  }
  return weight;
}

/** Mean absolute error over every known pair of days × slots (NaN when none). */
export function meanAbsError(actual: ArrayLike<number>[], forecast: ArrayLike<number>[]): number {
  let sum = 0, n = 0;
  actual.forEach((row, i) => {
    for (let k = 0; k < row.length; k++) {
      const e = Math.abs(row[k] - forecast[i][k]);
      if (Number.isFinite(e)) { sum += e; n++; }
    }
  });
  return n ? sum / n : NaN;
}
