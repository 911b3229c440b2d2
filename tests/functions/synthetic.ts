import seedrandom from 'seedrandom';
import {
  addDays, createModel, dayLengthMinutes, dayStartUtc, formatTimestamp, inputFrame, Learner,
  toStoredModel, toWallClock, wallClockToSerial, type Series, type StoredModel,
} from '../../src/engine';

/**
 * An invented hourly market for the tests (not the demo scenario): a daily
 * price shape, cheaper weekends, a temperature driver that moves prices,
 * and seeded noise. `days` delivery days of history from `start`, then one
 * more day whose prices are unknown (tomorrow) but whose driver is known.
 */
export interface Synthetic {
  zone: string;
  times: number[];
  price: number[];
  temp: number[];
  /** local date of the day to forecast */
  tomorrow: string;
}

export function syntheticMarket(start: string, days: number, zone = 'Europe/Berlin', seed = 7): Synthetic {
  const rng = seedrandom(`spotloom-test-${seed}`);
  const times: number[] = [], price: number[] = [], temp: number[] = [];
  for (let d = 0; d <= days; d++) {
    const date = addDays(start, d);
    const t0 = dayStartUtc(date, zone);
    const n = dayLengthMinutes(date, zone) / 60;
    const weekday = new Date(`${date}T12:00:00Z`).getUTCDay();
    for (let k = 0; k < n; k++) {
      const t = t0 + k * 3_600_000;
      const hour = toWallClock(t, zone).minutes / 60;
      const c = 9 + 6 * Math.sin(d / 15) + 3 * Math.sin((2 * Math.PI * (hour - 9)) / 24) + (rng() - 0.5) * 2;
      const p = 48 + 14 * Math.sin((2 * Math.PI * (hour - 7)) / 24) - (weekday === 0 || weekday === 6 ? 9 : 0) - 0.9 * c + (rng() - 0.5) * 6;
      times.push(t);
      temp.push(Math.round(c * 10) / 10);
      price.push(d === days ? NaN : Math.round(p * 100) / 100);
    }
  }
  return { zone, times, price, temp, tomorrow: addDays(start, days) };
}

export function seriesOf(m: Synthetic, withTemp = true): Series {
  return { times: m.times, price: m.price, drivers: withTemp ? { temp: m.temp } : {}, resolution: 60, zone: m.zone };
}

/** A linear model trained on the history (everything before tomorrow), stored as the workbook keeps it. */
export function trainedModel(m: Synthetic, name = 'test-linear', withTemp = true): StoredModel {
  const learner = createModel('linear', { seed: 3 }) as Learner;
  const s = seriesOf(m, withTemp);
  const known = s.price.findIndex(Number.isNaN);
  const cut = (a: number[]) => a.slice(0, known);
  learner.fit(inputFrame({ ...s, times: cut(s.times), price: cut(s.price), drivers: withTemp ? { temp: cut(m.temp) } : {} }));
  return toStoredModel(learner, { name, zone: m.zone, resolution: 60, createdAt: '2025-11-01T08:00:00Z' });
}

/** Spreadsheet date serials (1900 system) of the instants: wall-clock time in the zone. */
export function serials(m: Synthetic): number[] {
  return m.times.map((t) => wallClockToSerial(toWallClock(t, m.zone)));
}

export function isoTexts(m: Synthetic): string[] {
  return m.times.map((t) => formatTimestamp(t, m.zone));
}

/** A column range as the host passes it: rows × 1, empty cells as ''. */
export function column(values: (number | string)[]): (number | string)[][] {
  return values.map((v) => [typeof v === 'number' && Number.isNaN(v) ? '' : v]);
}
