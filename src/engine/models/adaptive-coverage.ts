/**
 * Adaptive conformal inference (Gibbs & Candès 2021, "Adaptive conformal
 * inference under distribution shift", NeurIPS 34): after each day whose
 * prices became known, the coverage a band is built at moves by
 * γ × (share of that day's periods outside the band − (1 − nominal)), so
 * the long-run share of misses returns to the nominal one even when errors
 * drift (a season turning, a level shift, a model still learning after a
 * short history). The split-conformal band (bands.ts) is then built at the
 * adjusted coverage.
 */
export const ADAPT_RATE = 0.05;
/** the adjusted coverage stays within this distance of the nominal one, and below 1 */
const REACH = 0.15;
const TOP = 0.995;

/** The adjusted coverage after a day with share `missed` of its periods outside the band built at `current`. */
export function adaptCoverage(nominal: number, current: number, missed: number): number {
  if (!Number.isFinite(missed)) return current;
  const next = current + ADAPT_RATE * (missed - (1 - nominal));
  return Math.min(TOP, nominal + REACH, Math.max(nominal - REACH, next));
}

/** Share of the known actual prices outside [lower, upper] (NaN when no band edge or price is known). */
export function missedShare(actual: ArrayLike<number>, lower: ArrayLike<number>, upper: ArrayLike<number>): number {
  let missed = 0, n = 0;
  for (let k = 0; k < actual.length; k++) {
    if (!Number.isFinite(actual[k]) || !Number.isFinite(lower[k]) || !Number.isFinite(upper[k])) continue;
    n++;
    if (actual[k] < lower[k] || actual[k] > upper[k]) missed++;
  }
  return n ? missed / n : NaN;
}
