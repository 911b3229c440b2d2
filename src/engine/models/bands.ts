/**
 * Prediction bands from recent out-of-sample errors by split-conformal
 * prediction (Vovk, Gammerman & Shafer 2005; Lei, G'Sell, Rinaldo,
 * Tibshirani & Wasserman 2018, "Distribution-free predictive inference for
 * regression", JASA 113(523)). Errors are kept per clock slot in units of
 * each day's level scale, so a band widens when prices become more volatile.
 *
 * With n pooled errors, the band at coverage c runs from the k-th smallest
 * error, k = ⌊(n + 1)(1 − c)/2⌋, to the k'-th, k' = ⌈(n + 1)(1 + c)/2⌉: the
 * finite-sample correction that makes each side cover at least its share
 * when errors are exchangeable. With too few errors for a coverage (k < 1 or
 * k' > n) the band is unknown (NaN) rather than too narrow.
 *
 * @example 99 pooled errors at c = 0.9: the 5th smallest and the 95th
 */
export interface ResidualPool {
  /** per slot, oldest first: (actual − forecast) / day scale */
  bySlot: number[][];
  keep: number;
}

/** One band of a forecast day. */
export interface Band {
  coverage: number;
  lower: Float64Array;
  upper: Float64Array;
}

/** The nominal coverages every learned model reports a band for (the backtest scores each). */
export const REPORTED_COVERAGES = [0.5, 0.8, 0.9, 0.98];

export function emptyPool(slots: number, keep: number): ResidualPool {
  return { bySlot: Array.from({ length: slots }, () => []), keep };
}

export function addResiduals(pool: ResidualPool, actual: ArrayLike<number>, forecast: ArrayLike<number>, scale: number): void {
  pool.bySlot.forEach((list, s) => {
    // 32-bit, as the pool has always kept them (the model file packs them further: model-file/packed-floats.ts)
    const r = Math.fround((actual[s] - forecast[s]) / scale);
    if (!Number.isFinite(r)) return;
    list.push(r);
    if (list.length > pool.keep) list.shift();
  });
}

/**
 * Bands around a point forecast at each coverage. Slots with few errors
 * borrow from their neighbours (±1 hour): every slot pools its own errors
 * with those of the clock slots within an hour of it.
 */
export function bands(pool: ResidualPool, point: Float64Array, scale: number, coverages: number[]): Band[] {
  const slots = point.length;
  const out = coverages.map((coverage) => ({ coverage, lower: new Float64Array(slots), upper: new Float64Array(slots) }));
  const reach = Math.max(1, Math.round(slots / 24));
  for (let s = 0; s < slots; s++) {
    let n = 0;
    for (let k = -reach; k <= reach; k++) n += pool.bySlot[(s + k + slots) % slots]?.length ?? 0;
    // a typed array sorts numerically and fast: this runs for every slot of every forecast
    const near = new Float64Array(n);
    let i = 0;
    for (let k = -reach; k <= reach; k++) for (const r of pool.bySlot[(s + k + slots) % slots] ?? []) near[i++] = r;
    near.sort();
    for (const b of out) {
      const { lo, hi } = conformalRanks(n, b.coverage);
      b.lower[s] = lo >= 1 ? point[s] + scale * near[lo - 1] : NaN;
      b.upper[s] = hi <= n ? point[s] + scale * near[hi - 1] : NaN;
    }
  }
  return out;
}

/** The band at one coverage (see `bands`). */
export function band(pool: ResidualPool, point: Float64Array, scale: number, coverage: number): { lower: Float64Array; upper: Float64Array } {
  const [{ lower, upper }] = bands(pool, point, scale, [coverage]);
  return { lower, upper };
}

/**
 * 1-based ranks of the order statistics that bound a central band at
 * `coverage` among n errors (split-conformal, each side (1 − c)/2).
 * @example conformalRanks(99, 0.9) // { lo: 5, hi: 95 }
 */
export function conformalRanks(n: number, coverage: number): { lo: number; hi: number } {
  const tail = (1 - coverage) / 2;
  // a hair of slack so that (n + 1) · 0.05 = 5 exactly is not taken for 5.000000000000001
  return { lo: Math.floor((n + 1) * tail + 1e-9), hi: Math.ceil((n + 1) * (1 - tail) - 1e-9) };
}

/** Quantile of sorted values, linear interpolation between order statistics (Hyndman & Fan 1996, type 7). */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
