import { describe, expect, it } from 'vitest';
import { nextDay } from '../../src/functions/next-day';
import { engineForecast, fixture, oneTable } from './fixture';

describe('nextDay', () => {
  it('nextDay(stored, ranges) forecasts the delivery day after the last price, all 25 periods of 2025-10-26', () => {
    const { market, stored } = fixture();
    const { day, rows } = nextDay(stored, oneTable(market));
    expect(day).toBe('2025-10-26');
    expect(rows).toHaveLength(25);
    // the adapter must give exactly what the engine gives on the same data
    expect(rows.map((r) => r.forecast)).toEqual(engineForecast(stored, market).map((r) => r.forecast));
  });

  it('nextDay gives the same answer however often it runs (a fresh learner each time)', () => {
    const { market, stored } = fixture();
    const first = nextDay(stored, oneTable(market)).rows;
    // forecast 2025-10-25 first: a shared learner would later take that day's errors into its band pool
    const n = market.times.length - 25;
    const earlier = { ...market, times: market.times.slice(0, n), temp: market.temp.slice(0, n), price: market.price.slice(0, n).map((p, i) => (i >= n - 24 ? NaN : p)) };
    expect(nextDay(stored, oneTable(earlier)).day).toBe('2025-10-25');
    expect(nextDay(stored, oneTable(market)).rows).toEqual(first);
  });

  it('nextDay keeps no band pool between forecasts: another coverage later equals a model loaded afresh', () => {
    // the decoded model is kept per loaded model (freshLearner), forecasts per ranges and coverage;
    // a model whose errors end ten days before the ranges do takes those days into its band pool when it
    // forecasts, which must not carry over to the next forecast. structuredClone(...) is a model no cache has seen.
    const { market, stored: full } = fixture();
    const stored = { ...full, residualsThrough: '2025-10-15' };
    nextDay(stored, oneTable(market));
    const shared = nextDay(stored, oneTable(market), { coverage: 0.8 }).rows;
    expect(shared).toEqual(nextDay(structuredClone(stored), oneTable(market), { coverage: 0.8 }).rows);
    expect(shared.every((r) => Number.isFinite(r.lower) && r.lower < r.upper)).toBe(true);
  });

  it('nextDay refuses a model with drivers when no driver range is given', () => {
    const { market, stored } = fixture();
    const { times, prices } = oneTable(market);
    expect(() => nextDay(stored, { times, prices })).toThrow(/trained with the driver temp: give their range/);
  });

  it('nextDay refuses ranges of another resolution than the model\'s', () => {
    const { market, stored } = fixture();
    // keep every other hour: two-hour steps are no delivery-period length
    const pick = <T,>(a: T[]) => a.filter((_, i) => i % 2 === 0);
    const t = oneTable(market);
    expect(() => nextDay(stored, { times: pick(t.times), prices: pick(t.prices), drivers: pick(t.drivers) })).toThrow(/120 minutes apart/);
  });
});
