import { InputError } from '../errors';
import { frameBefore, type DayFrame } from '../series/day-frame';
import { expandDay } from '../series/day-matrix';
import { inputFrame } from '../series/input-frame';
import { addDays } from '../calendar/weekday';
import { dayStartUtc } from '../series/local-clock';
import type { Series } from '../series/series';
import type { DayAheadModel } from './model';

export interface AheadRow {
  time: number;
  forecast: number;
  lower: number;
  upper: number;
}

/**
 * Forecasts the delivery day right after the last known price, the daily
 * case: history with prices, then the next day's rows with driver forecasts
 * and an empty price. When driver rows for further days follow (a weekend
 * ahead), those days are forecast too, each from the forecasts before it.
 *
 * @param drivers the driver columns the model needs (empty: none)
 * @throws InputError when the next day's driver rows are missing
 */
export function forecastAhead(model: DayAheadModel, series: Series, drivers: string[]): { rows: AheadRow[]; days: string[]; notes: string[] } {
  const { full, frame, first, given } = nextDayFrame(series, drivers);
  const lastKnown = frame.days[first - 1].date;
  const notes: string[] = [];
  const lastDay = frame.days[first - 1];
  const known = full.price.slice(lastDay.start, lastDay.start + lastDay.count).filter((p) => !Number.isNaN(p)).length;
  if (known < lastDay.expected) {
    notes.push(`${lastKnown}, the last day with prices, has ${known} of ${lastDay.expected}; its other periods take the same period of the day before`);
  }
  const rows: AheadRow[] = [];
  const days: string[] = [];
  for (let d = first; d < frame.days.length; d++) {
    if (d > first && !(drivers.length && given(d))) break;
    const f = model.predict(frameBefore(frame, d));
    const day = frame.days[d];
    const point = expandDay(day, f.point);
    const lower = f.lower ? expandDay(day, f.lower) : undefined;
    const upper = f.upper ? expandDay(day, f.upper) : undefined;
    for (let j = 0; j < day.count; j++) {
      rows.push({ time: full.times[day.start + j], forecast: point[j], lower: lower?.[j] ?? NaN, upper: upper?.[j] ?? NaN });
    }
    days.push(day.date);
    frame.price.push(Float64Array.from(f.point));
  }
  if (days.length > 1) notes.push(`${days.slice(1).join(', ')} use the forecasts of the days before them as their price history`);
  return { rows, days, notes };
}

/**
 * The frame a forecast of the next day reads, with the index `first` of
 * that day (the day after the last known price) and a test of whether a day
 * has the driver rows it needs, judged on the raw rows (the input frame
 * fills unknown values from earlier days).
 *
 * @throws InputError when there is no price, or the next day's driver rows are missing
 */
export function nextDayFrame(series: Series, drivers: string[]): { full: Series; frame: DayFrame; first: number; given: (d: number) => boolean } {
  const { full, frame } = framed(series, drivers.length === 0);
  const first = frame.price.length;
  if (first === 0) throw new InputError('there is no known price to forecast from');
  const given = (d: number) => drivers.every((n) => {
    const day = frame.days[d];
    return n in full.drivers && full.drivers[n].slice(day.start, day.start + day.count).some((v) => !Number.isNaN(v));
  });
  if (first >= frame.days.length || !given(first)) {
    throw new InputError(
      `the forecast for ${addDays(frame.days[first - 1].date, 1)} needs its rows: timestamps of that day with ${drivers.join(', ')} filled in and price left empty`,
    );
  }
  return { full, frame, first, given };
}

/**
 * The series' input frame (with the next day's empty rows added for a model
 * without drivers), built once per series object: cells that forecast from
 * the same ranges share it (functions/range-cache.ts hands them one series).
 * Each caller gets its own `price` list, which the forecast extends.
 */
const frames = new WeakMap<Series, { plain?: { full: Series; frame: DayFrame }; withNext?: { full: Series; frame: DayFrame } }>();

function framed(series: Series, addNextDay: boolean): { full: Series; frame: DayFrame } {
  let memo = frames.get(series);
  if (!memo) frames.set(series, (memo = {}));
  const which = addNextDay ? 'withNext' : 'plain';
  if (!memo[which]) {
    const full = addNextDay ? withNextDay(series) : series;
    memo[which] = { full, frame: inputFrame(full) };
  }
  const { full, frame } = memo[which]!;
  return { full, frame: { ...frame, price: frame.price.slice() } };
}

/** The series with empty rows for the local day after its last period's day (for models without drivers). */
export function withNextDay(series: Series): Series {
  const step = series.resolution * 60_000;
  let lastPrice = series.price.length - 1;
  while (lastPrice >= 0 && Number.isNaN(series.price[lastPrice])) lastPrice--;
  if (lastPrice < 0) return series;
  const lastDate = new Date(series.times[lastPrice]);
  // the local date of the last price: find it from the zone's day starts
  let date = lastDate.toISOString().slice(0, 10);
  while (dayStartUtc(addDays(date, 1), series.zone) <= series.times[lastPrice]) date = addDays(date, 1);
  while (dayStartUtc(date, series.zone) > series.times[lastPrice]) date = addDays(date, -1);
  const end = dayStartUtc(addDays(date, 2), series.zone);
  const times = series.times.slice(0, lastPrice + 1);
  for (let t = times[times.length - 1] + step; t < end; t += step) times.push(t);
  const pad = <T extends number>(a: T[]) => [...a.slice(0, lastPrice + 1), ...new Array(times.length - lastPrice - 1).fill(NaN)];
  const drivers: Record<string, number[]> = {};
  for (const [k, v] of Object.entries(series.drivers)) drivers[k] = pad(v);
  return { ...series, times, price: pad(series.price), drivers };
}
