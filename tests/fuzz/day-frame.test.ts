import fc from 'fast-check';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { dayFrame, dayIndexOf, deliveryDays, frameBefore, inputFrame, isComplete, targetDay, type Series } from '../../src/engine';
import { outcome, params, ZONES } from './support';

/**
 * deliveryDays, dayFrame and inputFrame on generated regular series in
 * zones with daylight saving, without it, with half- and quarter-hour
 * offsets and with a 30-minute shift. The reference for each period's local
 * day and clock slot is luxon's wall clock (a general-purpose date library).
 */

const START_DATES = ['2025-03-29', '2025-10-25', '2024-03-09', '2024-11-02', '2025-04-05', '2025-10-04', '2024-04-06', '2024-09-28', '2025-09-27', '2025-04-05'];

const seriesPlan = fc.record({
  zone: fc.constantFrom(...ZONES),
  resolution: fc.constantFrom(15, 30, 60) as fc.Arbitrary<15 | 30 | 60>,
  startDate: fc.oneof(fc.constantFrom(...START_DATES), fc.date({ min: new Date('1972-01-01'), max: new Date('2090-01-01'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10))),
  // start on the local day's grid, or at any instant on the UTC grid of the resolution
  startShift: fc.integer({ min: -30, max: 30 }),
  onLocalGrid: fc.boolean(),
  days: fc.integer({ min: 1, max: 5 }),
  values: fc.array(fc.oneof({ weight: 4, arbitrary: fc.double({ min: -200, max: 900, noNaN: true }) }, { weight: 1, arbitrary: fc.constant(NaN) }), { minLength: 600, maxLength: 600 }),
  driver: fc.boolean(),
});

function makeSeries(p: typeof seriesPlan extends fc.Arbitrary<infer T> ? T : never): Series {
  const step = p.resolution * 60_000;
  const midnight = DateTime.fromISO(p.startDate, { zone: p.zone }).startOf('day').toMillis();
  const t0 = p.onLocalGrid ? midnight + p.startShift * step : Math.floor(midnight / step) * step + p.startShift * step;
  const n = Math.min(600, Math.round((p.days * 1440) / p.resolution));
  const times = Array.from({ length: n }, (_, i) => t0 + i * step);
  const price = p.values.slice(0, n);
  const drivers: Record<string, number[]> = p.driver ? { load: price.map((v, i) => (Number.isNaN(v) ? v : i)) } : {};
  return { times, price, drivers, resolution: p.resolution, zone: p.zone };
}

const wall = (t: number, zone: string) => {
  const d = DateTime.fromMillis(t, { zone });
  return { date: d.toISODate()!, minutes: d.hour * 60 + d.minute + d.second / 60 };
};

describe('deliveryDays(series)', () => {
  it('puts every period in its local day, on the clock slot of its local start, in order', () => {
    fc.assert(fc.property(seriesPlan, (p) => {
      const series = makeSeries(p);
      const days = deliveryDays(series);
      const wrong: string[] = [];
      let i = 0;
      for (const day of days) {
        if (day.start !== i || day.slots.length !== day.count) wrong.push(`day ${day.date} starts at ${day.start}`);
        const start = DateTime.fromISO(day.date, { zone: series.zone }).startOf('day');
        const expected = (start.plus({ days: 1 }).toMillis() - start.toMillis()) / 60_000 / series.resolution;
        if (day.expected !== expected) wrong.push(`day ${day.date} expects ${day.expected}, not ${expected}`);
        for (let j = 0; j < day.count; j++, i++) {
          const w = wall(series.times[i], series.zone);
          const slot = Math.floor(w.minutes / series.resolution);
          if (w.date !== day.date || day.slots[j] !== slot) {
            wrong.push(`period ${i} at ${new Date(series.times[i]).toISOString()} is ${day.date} slot ${day.slots[j]}, not ${w.date} slot ${slot}`);
          }
        }
      }
      expect(wrong.slice(0, 3)).toEqual([]);
      expect(i).toBe(series.times.length);
      expect(new Set(days.map((d) => d.date)).size).toBe(days.length);
    }), params(300, 21));
  });
});

describe('dayFrame(series) and inputFrame(series)', () => {
  it('lay each day out by clock slot: means of its periods, skipped slots between their neighbours, fills only from earlier days', () => {
    fc.assert(fc.property(seriesPlan, (p) => {
      const series = makeSeries(p);
      const frame = dayFrame(series);
      const slots = 1440 / series.resolution;
      expect(frame.slots).toBe(slots);
      const wrong: string[] = [];
      frame.days.forEach((day, d) => {
        const row = frame.price[d];
        if (row.length !== slots) wrong.push(`day ${d} has ${row.length} slots`);
        const bySlot = new Map<number, number[]>();
        for (let j = 0; j < day.count; j++) {
          const v = series.price[day.start + j];
          if (!bySlot.has(day.slots[j])) bySlot.set(day.slots[j], []);
          if (!Number.isNaN(v)) bySlot.get(day.slots[j])!.push(v);
        }
        const known = [...bySlot.values()].filter((v) => v.length).map((v) => v.reduce((a, b) => a + b, 0) / v.length);
        for (let s = 0; s < slots; s++) {
          const vs = bySlot.get(s);
          let ok: boolean;
          if (vs) ok = vs.length === 0 ? Number.isNaN(row[s]) : Math.abs(row[s] - vs.reduce((a, b) => a + b, 0) / vs.length) < 1e-9;
          else if (!isComplete(day)) ok = Number.isNaN(row[s]);
          // a skipped slot of a complete short day lies between the day's known values
          else ok = Number.isNaN(row[s]) || (row[s] >= Math.min(...known) - 1e-9 && row[s] <= Math.max(...known) + 1e-9);
          if (!ok) wrong.push(`day ${day.date} slot ${s} is ${row[s]}`);
        }
      });
      expect(wrong.slice(0, 3)).toEqual([]);

      const input = inputFrame(series);
      // price rows end with the last day holding a known price
      const lastKnown = frame.price.reduce((last, row, d) => (row.some((v) => !Number.isNaN(v)) ? d : last), -1);
      expect(input.price.length).toBe(lastKnown + 1);
      for (let s = 0; s < slots; s++) {
        let last = NaN;
        for (let d = 0; d < input.price.length; d++) {
          const raw = frame.price[d][s];
          if (!Number.isNaN(raw)) last = raw;
          if (!Object.is(input.price[d][s], last)) wrong.push(`filled day ${d} slot ${s} is ${input.price[d][s]}, not ${last}`);
        }
      }
      expect(wrong.slice(0, 3)).toEqual([]);
      for (const rows of Object.values(input.drivers)) expect(rows).toHaveLength(frame.days.length);

      // views never reach past their target day
      for (let d = 0; d < input.days.length; d++) {
        const view = frameBefore(input, d);
        expect(targetDay(view)).toBe(Math.min(d, input.price.length));
        for (const rows of Object.values(view.drivers)) expect(rows.length).toBe(d + 1);
      }
      expect(outcome(() => frameBefore(input, input.days.length)).ok).toBe(false);
      expect(outcome(() => frameBefore(input, -1)).ok).toBe(false);
      expect(dayIndexOf(input, input.days[0].date)).toBe(0);
      expect(dayIndexOf(input, '9999-12-31')).toBe(-1);
    }), params(250, 22));
  });
});
