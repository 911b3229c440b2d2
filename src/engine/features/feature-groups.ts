/**
 * The named feature groups a model can use. Each can be switched off; the
 * pane lists them with these labels. Prices enter on the level scale of
 * level-scale.ts, drivers standardised; profiles are hourly (sub-hourly
 * slots are averaged to the hour) so the input size does not grow fourfold
 * with quarter-hour products.
 */
export const FEATURE_GROUPS = [
  { id: 'price_lags', label: 'prices of each hour on D-1, D-2, D-3 and D-7' },
  { id: 'price_d1_stats', label: 'mean, minimum and maximum price of D-1' },
  { id: 'price_year_ago', label: 'prices of the same weekday 52 weeks earlier (off by default; needs two years of history)' },
  { id: 'price_changes', label: 'day-on-day and week-on-week change of the daily mean price' },
  { id: 'drivers_target', label: 'each driver for every hour of the target day' },
  { id: 'drivers_lagged', label: 'each driver for every hour of D-1 and D-7' },
  { id: 'residual_load', label: 'load minus wind and solar forecasts for every hour (when both are given)' },
  { id: 'weekday', label: 'day of the week (one-hot)' },
  { id: 'month', label: 'month of the year (cyclic sine and cosine)' },
  { id: 'holidays', label: 'public holiday and bridge day on D, holiday on D-1 (with a region)' },
] as const;

export type FeatureGroup = (typeof FEATURE_GROUPS)[number]['id'];

export const ALL_FEATURE_GROUPS: FeatureGroup[] = FEATURE_GROUPS.map((g) => g.id);

/**
 * The groups a model uses unless told otherwise: all but the year-ago
 * prices, which measured worse on the bench markets (npm run bench, Brindlemoor
 * linear MAE 7.76 with them, 7.68 without; no change where the history is
 * shorter than two years) and are kept as an option.
 */
export const DEFAULT_FEATURE_GROUPS: FeatureGroup[] = ALL_FEATURE_GROUPS.filter((g) => g !== 'price_year_ago');

export function isFeatureGroup(id: string): id is FeatureGroup {
  return (ALL_FEATURE_GROUPS as string[]).includes(id);
}
