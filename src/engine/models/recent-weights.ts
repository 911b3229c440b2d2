import { bestMix3, meanAbsError, mix3 } from './blend-weights';

/**
 * The blend's weights follow the parts' recent errors: once RECENT_MIN_DAYS
 * out-of-sample days are known, the best convex mix (bestMix3) over the
 * newest RECENT_DAYS of them replaces the current weights when it beats
 * them there by 3 % (SWITCH_GAIN); otherwise the weights stay. Measured
 * (npm run bench, 2026-12-03): always following the recent mix cost 1–2 %
 * on the calm hourly market (it chases noise), never following it cost
 * 12 % on the market whose level doubles; the 3 % rule keeps the calm
 * market's weights and gets the shift market's gain. A rolling combination of recent errors is common practice in
 * forecast combination (Bates & Granger 1969; for electricity prices e.g.
 * Nowotarski, Raviv, Trück & Weron 2014, Energy Economics 46); here it lets
 * the blend lean on the part that copes best after a level shift.
 * The first remembered days are the newest holdout days of the fit (their
 * forecasts came from models fitted before them) and the fit applies the
 * rule to them, so a trained model, also a stored one, carries its newest
 * days' weights and a shift that starts before the last training day
 * counts from the first forecast on instead of after two weeks of it (npm run bench, 2026-12-03: Cindervale
 * blend 15.13 → 14.00, the calm markets unchanged).
 */
export const RECENT_DAYS = 28;
export const RECENT_MIN_DAYS = 14;
/** the recent best mix replaces the current weights only when it beats them by this factor on the recent days */
export const SWITCH_GAIN = 0.97;

/** One day's parts (per slot) and its actual prices. */
export interface PartsDay {
  actual: ArrayLike<number>;
  neural?: Float64Array;
  linear: Float64Array;
  lear?: Float64Array;
}

export function rememberDay(days: PartsDay[], day: PartsDay): void {
  days.push(day);
  if (days.length > RECENT_DAYS) days.shift();
}

/**
 * The weights of neural and LEAR on the remembered days (the linear part has
 * the rest) when they beat the current ones there by SWITCH_GAIN, otherwise
 * undefined (also while too few days are known).
 */
export function recentWeights(days: PartsDay[], current: { neural: number; lear: number }): { neural: number; lear: number } | undefined {
  if (days.length < RECENT_MIN_DAYS) return undefined;
  const useNeural = days.every((d) => d.neural), useLear = days.every((d) => d.lear);
  const nn = useNeural ? days.map((d) => d.neural!) : [];
  const lear = useLear ? days.map((d) => d.lear!) : [];
  const actual = days.map((d) => d.actual);
  const linear = days.map((d) => d.linear);
  const score = (preds: Float64Array[]) => meanAbsError(actual, preds);
  const { wa, wc } = bestMix3(nn, linear, lear, score, { a: useNeural, c: useLear });
  const now = score(mix3(nn, linear, lear, useNeural ? current.neural : 0, useLear ? current.lear : 0));
  return score(mix3(nn, linear, lear, wa, wc)) < SWITCH_GAIN * now ? { neural: wa, lear: wc } : undefined;
}
