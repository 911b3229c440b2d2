/**
 * Prediction bands from recent out-of-sample errors (empirical quantiles,
 * in the spirit of split-conformal prediction: Vovk, Gammerman & Shafer
 * 2005). Errors are kept per clock slot in units of each day's level scale,
 * so a band widens when prices become more volatile.
 */
export interface ResidualPool {
  /** per slot, oldest first: (actual − forecast) / day scale */
  bySlot: number[][];
  keep: number;
}

export function emptyPool(slots: number, keep: number): ResidualPool {
  return { bySlot: Array.from({ length: slots }, () => []), keep };
}

export function addResiduals(pool: ResidualPool, actual: ArrayLike<number>, forecast: ArrayLike<number>, scale: number): void {
  pool.bySlot.forEach((list, s) => {
    // 32-bit, like the stored model keeps them, so a loaded model bands exactly alike
    const r = Math.fround((actual[s] - forecast[s]) / scale);
    if (!Number.isFinite(r)) return;
    list.push(r);
    if (list.length > pool.keep) list.shift();
  });
}

/**
 * Lower and upper band for a point forecast at the given coverage (0.9 →
 * the 5 % and 95 % empirical quantiles). Slots with few errors borrow from
 * their neighbours (±1 hour) so a band never rests on a handful of values.
 */
export function band(pool: ResidualPool, point: Float64Array, scale: number, coverage: number): { lower: Float64Array; upper: Float64Array } {
  const slots = point.length;
  const lower = new Float64Array(slots);
  const upper = new Float64Array(slots);
  const reach = Math.max(1, Math.round(slots / 24));
  for (let s = 0; s < slots; s++) {
    let n = 0;
    for (let k = -reach; k <= reach; k++) n += pool.bySlot[(s + k + slots) % slots]?.length ?? 0;
    if (n < 5) { lower[s] = NaN; upper[s] = NaN; continue; }
    // a typed array sorts numerically and fast: this runs for every slot of every forecast
    const near = new Float64Array(n);
    let i = 0;
    for (let k = -reach; k <= reach; k++) for (const r of pool.bySlot[(s + k + slots) % slots] ?? []) near[i++] = r;
    near.sort();
    lower[s] = point[s] + scale * quantile(near, (1 - coverage) / 2);
    upper[s] = point[s] + scale * quantile(near, (1 + coverage) / 2);
  }
  return { lower, upper };
}

/** Quantile of sorted values, linear interpolation between order statistics (Hyndman & Fan 1996, type 7). */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
