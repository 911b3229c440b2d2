import { compareForecasts, InputError, type LossKind } from '../engine';
import { cellList, cellNumber, isBlank, isOmitted, textArg } from './cells';
import { readDate, type DateSystem } from './timestamps';

/**
 * LOOM.COMPARE: the one-sided Diebold–Mariano p-value (HLN small-sample
 * correction, h = 1, Student t) for "forecast A is more accurate than
 * forecast B", taken on one loss difference per delivery day as is usual
 * for day-ahead prices (the engine's compareForecasts). A small value
 * (below 0.05, say) says A is better than B beyond chance.
 *
 * The signature has no timestamps, so the fifth argument says how rows form
 * delivery days:
 * - a whole number: that many consecutive rows per day (default 24, hourly
 *   periods), counted from the first row, which must start a day. Days with
 *   23 or 25 periods (clock changes) shift this count; give timestamps then;
 * - a range of timestamps beside actual: rows are grouped by the calendar
 *   date each timestamp is written in (a date serial's day, or the date of
 *   ISO text in its own offset), exact on daylight-saving days.
 *
 * @example compare(actual, a, b) // 0.012
 */
export function compare(actual: unknown, a: unknown, b: unknown, loss: unknown, days: unknown, options: { dateSystem?: DateSystem } = {}): number {
  const x = numbers(actual, 'actual');
  const fa = numbers(a, 'forecastA');
  const fb = numbers(b, 'forecastB');
  if (fa.length !== x.length || fb.length !== x.length) {
    throw new InputError(`actual, forecastA and forecastB must be the same size (got ${x.length}, ${fa.length} and ${fb.length} cells)`);
  }
  const kind = textArg(loss, 'loss', 'abs').toLowerCase();
  if (kind !== 'abs' && kind !== 'squared') throw new InputError(`loss "${kind}" is not known; use "abs" or "squared"`);
  return compareForecasts(x, fa, fb, dayIndex(days, x.length, options.dateSystem), kind as LossKind).pValue;
}

function dayIndex(days: unknown, n: number, dateSystem: DateSystem = '1900'): number[] {
  const cells = isOmitted(days) ? [24] : cellList(days, 'days');
  if (cells.length === 1 && typeof cells[0] === 'number') {
    const per = cells[0];
    if (!Number.isInteger(per) || per < 1) throw new InputError(`periods per day must be a whole number such as 24, 48 or 96; got ${per}`);
    return Array.from({ length: n }, (_, i) => Math.floor(i / per));
  }
  if (cells.length !== n) throw new InputError(`the timestamps range has ${cells.length} cells but actual has ${n}; give one timestamp per row`);
  const index = new Map<string, number>();
  return cells.map((v, i) => {
    if (isBlank(v)) throw new InputError('has no timestamp', { column: 'timestamps', row: i + 1 });
    const date = readDate(v, `timestamps row ${i + 1}`, dateSystem);
    if (!index.has(date)) index.set(date, index.size);
    return index.get(date)!;
  });
}

function numbers(range: unknown, what: string): number[] {
  return cellList(range, what).map((v, i) => cellNumber(v, { column: what, row: i + 1 }));
}
