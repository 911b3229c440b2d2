import { createModel, dayFrame, frameBefore, inputFrame, type Learner, type Series } from '../../../src/engine';
import { SMALL } from '../../support/small-learner';
import { syntheticSeries } from '../../support/synthetic';

export { SMALL };

/** The model trains on the first 130 delivery days; tomorrow is day 130 (drivers given, price empty). */
export const HISTORY_DAYS = 130;
const cache = new Map<string, { learner: Learner; series: Series }>();

/** Indices of the periods of delivery day `d` of the series (local days: 23 or 25 periods at a clock change). */
export function periodsOf(series: Series, d: number): { start: number; end: number } {
  const day = dayFrame(series).days[d];
  return { start: day.start, end: day.start + day.count };
}

/** The invented series up to tomorrow, whose price is left empty. */
export function tomorrowSeries(): Series {
  const full = syntheticSeries(140);
  const { start, end } = periodsOf(full, HISTORY_DAYS);
  return { ...full, times: full.times.slice(0, end), price: full.price.slice(0, end).map((p, i) => (i >= start ? NaN : p)),
    drivers: { load_forecast: full.drivers.load_forecast.slice(0, end) } };
}

/** A learner trained once per kind, seed and tag (a new tag trains a fresh one). */
export function trained(kind: 'linear' | 'neural' | 'blend', seed = 4, tag = ''): { learner: Learner; series: Series } {
  const key = `${kind}-${seed}-${tag}`;
  let hit = cache.get(key);
  if (!hit) {
    const series = tomorrowSeries();
    const learner = createModel(kind, { ...SMALL, seed }) as Learner;
    learner.fit(frameBefore(inputFrame(series), HISTORY_DAYS));
    hit = { learner, series };
    cache.set(key, hit);
  }
  return hit;
}
