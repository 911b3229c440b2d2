/**
 * The blend's weights: a weighted mix of the parts' forecasts per day, and
 * the weights (a grid of 0.05 steps on the simplex) whose mix scores best,
 * the earliest on a tie. Common practice for forecast combination with few
 * parts: a constrained grid search on a validation block (convex weights
 * keep the blend inside the range of its parts).
 */
export function mix(a: Float64Array[], b: Float64Array[], wa: number): Float64Array[] {
  if (wa === 0 || a.length === 0) return b;
  if (wa === 1) return a;
  return a.map((row, i) => row.map((v, k) => wa * v + (1 - wa) * b[i][k]));
}

/** `wa` on a, `wc` on c and the rest on b, per day and slot. */
export function mix3(a: Float64Array[], b: Float64Array[], c: Float64Array[], wa: number, wc: number): Float64Array[] {
  if (wc === 0 || c.length === 0) return mix(a, b, wa);
  return b.map((row, i) => row.map((v, k) => (wa ? wa * a[i][k] : 0) + wc * c[i][k] + (1 - wa - wc) * v));
}

export function bestMixWeight(a: Float64Array[], b: Float64Array[], score: (preds: Float64Array[]) => number): number {
  return bestMix3(a, b, [], score, { a: true, c: false }).wa;
}

/** Best convex weights of a, c (and b the rest); a part switched off keeps weight 0. */
export function bestMix3(
  a: Float64Array[], b: Float64Array[], c: Float64Array[], score: (preds: Float64Array[]) => number, use: { a: boolean; c: boolean },
): { wa: number; wc: number } {
  let best = Infinity, wa = 0, wc = 0;
  const steps = 20;
  for (let i = 0; i <= (use.a ? steps : 0); i++) {
    for (let j = 0; j <= (use.c ? steps - i : 0); j++) {
      const e = score(mix3(a, b, c, i / steps, j / steps));
      if (e < best - 1e-12) { best = e; wa = i / steps; wc = j / steps; }
    }
  }
  return { wa, wc };
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
