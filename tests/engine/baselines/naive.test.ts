import { describe, expect, it } from 'vitest';
import { BASELINE_KINDS, baselineForecast, baselineLag, baselineModel, dayFrame, frameBefore } from '../../../src/engine';
import { syntheticSeries } from '../../support/synthetic';

describe('baselineLag(kind, date)', () => {
  // 2025-01-06 is a Monday (ISO 8601 weekday 1; from memory, checked against the calendar of January 2025)
  const week = ['2025-01-06', '2025-01-07', '2025-01-08', '2025-01-09', '2025-01-10', '2025-01-11', '2025-01-12'];

  it('weekday-rule looks back 7 days for Monday, Saturday and Sunday and 1 day otherwise', () => {
    // source: Lago, Marcjasz, De Schutter & Weron (2021), Applied Energy 293, the naive benchmark of day-ahead price forecasting
    expect(week.map((d) => baselineLag('weekday-rule', d))).toEqual([7, 1, 1, 1, 1, 7, 7]);
  });

  it('naive-day is always D-1 and naive-week always D-7', () => {
    expect(week.map((d) => baselineLag('naive-day', d))).toEqual(new Array(7).fill(1));
    expect(week.map((d) => baselineLag('naive-week', d))).toEqual(new Array(7).fill(7));
  });

  it('follows the weekday across a year boundary and a leap day', () => {
    // 2024-12-30 Monday, 2024-02-29 Thursday, 2028-03-04 Saturday (from memory)
    expect(baselineLag('weekday-rule', '2024-12-30')).toBe(7);
    expect(baselineLag('weekday-rule', '2024-02-29')).toBe(1);
    expect(baselineLag('weekday-rule', '2028-03-04')).toBe(7);
  });
});

describe('baselineForecast(kind, view)', () => {
  const frame = dayFrame(syntheticSeries(21)); // local days from 2025-01-06 (a Monday) in Berlin

  it('copies the slot values of the lag day', () => {
    const tuesday = 8, monday = 7; // 2025-01-14 and 2025-01-13
    expect(frame.days[monday].date).toBe('2025-01-13');
    expect(Array.from(baselineForecast('weekday-rule', frameBefore(frame, tuesday)).point)).toEqual(Array.from(frame.price[tuesday - 1]));
    expect(Array.from(baselineForecast('weekday-rule', frameBefore(frame, monday)).point)).toEqual(Array.from(frame.price[monday - 7]));
    expect(Array.from(baselineForecast('naive-week', frameBefore(frame, tuesday)).point)).toEqual(Array.from(frame.price[tuesday - 7]));
    expect(Array.from(baselineForecast('naive-day', frameBefore(frame, monday)).point)).toEqual(Array.from(frame.price[monday - 1]));
  });

  it('gives a copy, not the history row itself', () => {
    const view = frameBefore(frame, 10);
    const { point } = baselineForecast('naive-day', view);
    point[0] = -1e9;
    expect(view.price[9][0]).not.toBe(-1e9);
  });

  it('gives NaN for every slot when the lag day is before the data', () => {
    const { point } = baselineForecast('naive-week', frameBefore(frame, 3));
    expect(point).toHaveLength(24);
    expect(Array.from(point).every(Number.isNaN)).toBe(true);
    expect(Array.from(baselineForecast('naive-day', frameBefore(frame, 0)).point).every(Number.isNaN)).toBe(true);
  });
});

describe('baselineModel(kind)', () => {
  it.each(BASELINE_KINDS)('%s needs no fitting and forecasts like baselineForecast', (kind) => {
    const model = baselineModel(kind);
    expect(model.name).toBe(kind);
    expect(model.minHistoryDays).toBe(kind === 'naive-day' ? 1 : 7);
    const view = frameBefore(dayFrame(syntheticSeries(21)), 12);
    model.fit(view);
    expect(model.predict(view)).toEqual(baselineForecast(kind, view));
  });
});
