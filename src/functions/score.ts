import { InputError, metricByName, METRIC_NAMES } from '../engine';
import { cellList, cellNumber, isOmitted, numberArg, textArg } from './cells';

/**
 * LOOM.SCORE: one error score of a forecast against actual prices. Empty
 * cells are unknown and their pairs are skipped. What the fourth argument
 * means depends on the metric:
 * - RMAE: the reference forecast (a range as long as actual), required;
 * - MASE: the season in periods for the in-sample seasonal naive scale,
 *   default 24 (one day of hourly periods);
 * - PINBALL: the quantile level tau of the forecast in (0, 1), required
 *   (e.g. 0.05 for the lower edge of a 90 % band);
 * - the others take none.
 *
 * @example score([[10], [12]], [[11], [12]], 'MAE') // 0.5
 */
export function score(actual: unknown, forecast: unknown, metric: unknown, reference: unknown): number {
  const a = numbers(actual, 'actual');
  const f = numbers(forecast, 'forecast');
  if (a.length !== f.length) throw new InputError(`actual has ${a.length} cells but forecast has ${f.length}; give ranges of the same size`);
  const name = textArg(metric, 'metric', 'MAE').toUpperCase();
  if (!(METRIC_NAMES as readonly string[]).includes(name)) throw new InputError(`unknown metric "${name}"; use one of ${METRIC_NAMES.join(', ')}`);
  let value: number;
  if (name === 'RMAE') {
    if (isOmitted(reference)) throw new InputError('RMAE needs the reference forecast as 4th argument (e.g. the LOOM.BASELINE column)');
    const r = numbers(reference, 'reference');
    if (r.length !== a.length) throw new InputError(`reference has ${r.length} cells but actual has ${a.length}; give ranges of the same size`);
    value = metricByName(name, a, f, { reference: r });
  } else if (name === 'MASE') {
    const season = numberArg(reference, 'season', 24);
    if (!Number.isInteger(season) || season < 1) throw new InputError(`the MASE season must be a whole number of periods, e.g. 24; got ${season}`);
    value = metricByName(name, a, f, { season });
  } else if (name === 'PINBALL') {
    const tau = numberArg(reference, 'tau', NaN);
    if (!(tau > 0 && tau < 1)) throw new InputError('PINBALL needs the quantile level tau of the forecast as 4th argument, between 0 and 1 (e.g. 0.05)');
    value = metricByName(name, a, f, { tau });
  } else {
    if (!isOmitted(reference)) throw new InputError(`${name} takes no 4th argument (only RMAE, MASE and PINBALL do)`);
    value = metricByName(name, a, f);
  }
  if (!Number.isFinite(value)) throw new InputError(`${name} has no finite value for these ranges (e.g. a zero scale); check the data`);
  return value;
}

function numbers(range: unknown, what: string): number[] {
  return cellList(range, what).map((v, i) => cellNumber(v, { column: what, row: i + 1 }));
}
