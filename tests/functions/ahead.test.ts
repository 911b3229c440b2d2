import { describe, expect, it } from 'vitest';
import { ahead } from '../../src/functions/ahead';
import { column } from './synthetic';
import { engineForecast, fixture, oneTable } from './fixture';

describe('ahead', () => {
  it('ahead(stored, ranges) spills one column equal to the engine forecast', () => {
    const { market, stored } = fixture();
    const out = ahead(stored, oneTable(market));
    expect(out.every((row) => row.length === 1)).toBe(true);
    expect(out.map((r) => r[0])).toEqual(engineForecast(stored, market).map((r) => r.forecast));
  });

  it('ahead reads ISO text timestamps the same as date serials', () => {
    const { market, stored } = fixture();
    expect(ahead(stored, oneTable(market, 'iso'))).toEqual(ahead(stored, oneTable(market, 'serial')));
  });

  it('ahead takes drivers from their own rows with driverTimes and a title row', () => {
    const { market, stored } = fixture();
    const t = oneTable(market);
    const n = market.times.length;
    // prices end with the history; the driver table runs one day further and has titles
    const separate = ahead(stored, {
      times: t.times.slice(0, n - 25), prices: t.prices.slice(0, n - 25),
      driverTimes: [['timestamp'], ...t.times], drivers: [['Temp'], ...t.drivers],
    });
    expect(separate).toEqual(ahead(stored, t));
  });

  it('ahead treats an empty price cell in the history as unknown, not zero', () => {
    const { market, stored } = fixture();
    const t = oneTable(market);
    const holed = t.prices.map((row, i) => (i === t.prices.length - 40 ? [''] : row));
    const zeroed = t.prices.map((row, i) => (i === t.prices.length - 40 ? [0] : row));
    const a = ahead(stored, { ...t, prices: holed });
    const z = ahead(stored, { ...t, prices: zeroed });
    expect(a).not.toEqual(z);
    expect(a.flat().every(Number.isFinite)).toBe(true);
  });

  it('ahead refuses text in a price cell, naming its row', () => {
    const { market, stored } = fixture();
    const t = oneTable(market);
    const bad = t.prices.map((row, i) => (i === 9 ? ['n/a'] : row));
    expect(() => ahead(stored, { ...t, prices: bad })).toThrow(/row 10, column "prices": "n\/a" is not a number/);
  });

  it('ahead refuses ranges of different heights', () => {
    const { market, stored } = fixture();
    const t = oneTable(market);
    expect(() => ahead(stored, { ...t, prices: t.prices.slice(1) })).toThrow(/times has \d+ cells but prices has \d+/);
  });

  it('ahead of a model without drivers needs only times and prices', () => {
    const { market, plain } = fixture();
    const t = oneTable(market);
    const out = ahead(plain, { times: t.times, prices: t.prices });
    expect(out.map((r) => r[0])).toEqual(engineForecast(plain, market, false).map((r) => r.forecast));
    expect(column([1])).toEqual([[1]]);
  });
});
