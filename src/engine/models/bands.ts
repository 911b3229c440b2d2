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
 * Bands around a point forecast at each coverage. Every slot pools its own
 * errors with those of the clock slots within an hour of it; where that is
 * still too few for the widest coverage asked (99 errors for 98 %, after a
 * short history), the reach grows hour by hour up to the whole day, so a
 * band is given wherever the day's errors suffice. `adjusted` (adaptive-
 * coverage.ts) gives the coverage each band is built at, when it differs
 * from the nominal one the pooling is sized for.
 */
export function bands(pool: ResidualPool, point: Float64Array, scale: number, coverages: number[], adjusted?: number[]): Band[] {
  const slots = point.length;
  const out = coverages.map((coverage) => ({ coverage, lower: new Float64Array(slots), upper: new Float64Array(slots) }));
  const hour = Math.max(1, Math.round(slots / 24));
  // the same reach for every band asked, so band() and bands() agree
  const need = Math.max(...[...coverages, ...REPORTED_COVERAGES].map(fewestErrors));
  const widest = Math.floor((slots - 1) / 2);
  // the slots within `reach` of s (every slot once, the whole day at most)
  const around = (s: number, reach: number) =>
    reach >= widest ? Array.from({ length: slots }, (_, k) => k) : Array.from({ length: 2 * reach + 1 }, (_, k) => (s + k - reach + slots) % slots);
  for (let s = 0; s < slots; s++) {
    let reach = hour;
    let near: number[] = around(s, reach);
    const size = (list: number[]) => list.reduce((n, k) => n + (pool.bySlot[k]?.length ?? 0), 0);
    while (size(near) < need && reach < widest) { reach = Math.min(reach + hour, widest); near = around(s, reach); }
    const n = size(near);
    // a typed array sorts numerically and fast: this runs for every slot of every forecast
    const errors = new Float64Array(n);
    let i = 0;
    for (const k of near) for (const r of pool.bySlot[k] ?? []) errors[i++] = r;
    errors.sort();
    out.forEach((b, i) => {
      const at = adjusted?.[i] ?? b.coverage;
      const { lo, hi } = conformalRanks(n, at);
      // an adjusted coverage beyond what the errors resolve takes the extremes, once they suffice for the nominal one
      const enough = n >= fewestErrors(Math.min(at, b.coverage));
      b.lower[s] = lo >= 1 ? point[s] + scale * errors[lo - 1] : enough ? point[s] + scale * errors[0] : NaN;
      b.upper[s] = hi <= n ? point[s] + scale * errors[hi - 1] : enough ? point[s] + scale * errors[n - 1] : NaN;
    });
  }
  return out;
}

/** Fewest errors whose order statistics bound a band at `coverage` (conformalRanks with lo = 1). */
export function fewestErrors(coverage: number): number {
  return Math.ceil(2 / (1 - coverage) - 1 - 1e-9);
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
