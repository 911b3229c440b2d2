import { learnerFromStored, forecastAhead, toWallClock, type StoredModel } from '../../src/engine';
import { column, isoTexts, serials, seriesOf, syntheticMarket, trainedModel, type Synthetic } from './synthetic';

/**
 * One invented market and one linear model trained on it, shared by the
 * forecast tests (training takes about a second). History 2025-06-28 to
 * 2025-10-25, tomorrow 2025-10-26: the autumn clock change, 25 hours.
 */
let cached: { market: Synthetic; stored: StoredModel; plain: StoredModel } | undefined;

export function fixture(): { market: Synthetic; stored: StoredModel; plain: StoredModel } {
  cached ??= (() => {
    const market = syntheticMarket('2025-06-28', 120);
    return { market, stored: trainedModel(market), plain: trainedModel(market, 'no-drivers', false) };
  })();
  return cached;
}

/** The ranges of the one-table layout: times, prices and the temp driver on the same rows. */
export function oneTable(m: Synthetic, as: 'serial' | 'iso' = 'serial') {
  const t = as === 'serial' ? serials(m) : isoTexts(m);
  return { times: column(t), prices: column(m.price), drivers: column(m.temp) };
}

/** The engine's own forecast of tomorrow on the same data (what the adapter must reproduce). */
export function engineForecast(stored: StoredModel, m: Synthetic, withTemp = true) {
  const { rows, days } = forecastAhead(learnerFromStored(stored), seriesOf(m, withTemp), withTemp ? ['temp'] : []);
  return rows.filter((r) => toWallClock(r.time, m.zone).date === days[0]);
}
