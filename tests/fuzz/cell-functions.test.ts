import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ahead } from '../../src/functions/ahead';
import { band } from '../../src/functions/band';
import { baseline } from '../../src/functions/baseline';
import { compare } from '../../src/functions/compare';
import { explain } from '../../src/functions/explain';
import { holiday } from '../../src/functions/holiday';
import { modelFacts, MODEL_FIELDS } from '../../src/functions/model-facts';
import { score } from '../../src/functions/score';
import { fixture, oneTable } from '../functions/fixture';
import { outcome, params } from './support';

/**
 * The LOOM cell functions' cores (src/functions) on hostile cell values:
 * numbers of every size, NaN and ±Infinity, numeric and other text, ISO
 * and serial timestamps, booleans, blanks, ragged and wrongly shaped
 * ranges, and valid ranges with a few cells damaged. The rule: finite
 * numbers (text for HOLIDAY and some MODEL fields) or an InputError, which
 * the adapter shows as #VALUE! with its message; any other exception would
 * reach the user as "Spotloom could not compute this".
 */

const cell = fc.oneof(
  { weight: 6, arbitrary: fc.double({ min: -500, max: 3000, noNaN: true }) },
  { weight: 2, arbitrary: fc.constantFrom('', null, ' ') },
  { weight: 1, arbitrary: fc.constantFrom(NaN, Infinity, -Infinity, 1e308, -1e308, 5e-324, 0, -0, 45_000.5, 60, 2_958_466) },
  { weight: 1, arbitrary: fc.constantFrom('12.5', ' 7 ', '1e999', 'NaN', 'abc', '#N/A', 'TRUE', '2025-03-30T03:00:00+02:00', '2025-10-26T02:00:00+01:00', '2025-03-30', '30.03.2025') },
  { weight: 1, arbitrary: fc.constantFrom(true, false) },
  { weight: 1, arbitrary: fc.string({ maxLength: 8 }) },
);
const range = fc.oneof(
  { weight: 4, arbitrary: fc.array(cell, { maxLength: 60 }).map((c) => c.map((v) => [v])) },
  { weight: 1, arbitrary: fc.array(fc.array(cell, { maxLength: 3 }), { maxLength: 8 }) },
  { weight: 1, arbitrary: fc.oneof(cell, fc.constant([]), fc.constant([[]]), fc.array(cell, { maxLength: 5 })) },
);

const finiteGrid = (out: unknown) => Array.isArray(out) && out.every((row) => Array.isArray(row) && row.every((v) => typeof v === 'number' && Number.isFinite(v)));

describe('LOOM.SCORE, LOOM.COMPARE, LOOM.BASELINE and LOOM.HOLIDAY on random cells', () => {
  it('score(actual, forecast, metric, reference) is a finite number or an InputError', () => {
    const metric = fc.oneof(fc.constantFrom('MAE', 'rmse', 'sMAPE', 'MAPE', 'MASE', 'RMAE', 'BIAS', 'PINBALL', null, ''), cell);
    fc.assert(fc.property(range, range, metric, fc.oneof(range, cell), (a, f, m, r) => {
      const got = outcome(() => score(a, f, m, r));
      if (got.ok) expect(Number.isFinite(got.value), `score gave ${got.value}`).toBe(true);
    }), params(800, 81));
  });

  it('compare(actual, a, b, loss, days) is a p-value in [0, 1] or an InputError', () => {
    fc.assert(fc.property(range, range, range, fc.oneof(fc.constantFrom('abs', 'squared', 'log', null), cell), fc.oneof(fc.constantFrom(null, 24, 1, 2, 0, -1, 1.5), range), (y, a, b, loss, days) => {
      const got = outcome(() => compare(y, a, b, loss, days));
      if (got.ok) {
        expect(got.value).toBeGreaterThanOrEqual(0);
        expect(got.value).toBeLessThanOrEqual(1);
      }
    }), params(600, 82));
  });

  it('baseline(times, prices, kind, zone) spills finite forecasts or gives an InputError', () => {
    fc.assert(fc.property(range, range, fc.oneof(fc.constantFrom('day', 'week', 'weekday-rule', null, 'month'), cell), fc.oneof(fc.constantFrom(null, 'Europe/Berlin', 'Australia/Adelaide', 'Mars/Base'), cell), (t, p, kind, zone) => {
      const got = outcome(() => baseline(t, p, kind, zone));
      if (got.ok) expect(finiteGrid(got.value)).toBe(true);
    }), params(500, 83));
  });

  it('baseline on a valid history with a few cells damaged', () => {
    const { market } = fixture();
    const t = oneTable(market);
    fc.assert(fc.property(fc.array(fc.tuple(fc.nat(), fc.boolean(), cell), { maxLength: 4 }), fc.constantFrom('day', 'week', 'weekday-rule'), fc.constantFrom('serial', 'iso') as fc.Arbitrary<'serial' | 'iso'>, (damage, kind, as) => {
      const base = oneTable(market, as);
      const times = base.times.map((r) => [...r]), prices = t.prices.map((r) => [...r]);
      for (const [at, inTimes, v] of damage) (inTimes ? times : prices)[at % times.length][0] = v as never;
      const got = outcome(() => baseline(times, prices, kind, null));
      if (got.ok) expect(finiteGrid(got.value)).toBe(true);
    }), params(15, 84));
  });

  it('holiday(date, region) is text or an InputError', () => {
    fc.assert(fc.property(cell, fc.oneof(fc.constantFrom('DE', 'DE-BY', 'FR', 'US-CA', 'GB-SCT', 'XX', '', null, '__proto__', 'constructor'), cell), (d, r) => {
      const got = outcome(() => holiday(d, r));
      if (got.ok) expect(typeof got.value).toBe('string');
    }), params(600, 85));
  });
});

describe('LOOM.AHEAD, LOOM.BAND and LOOM.MODEL with a stored model', () => {
  const damaged = fc.record({
    damage: fc.array(fc.tuple(fc.nat(), fc.constantFrom('times', 'prices', 'drivers'), cell), { maxLength: 4 }),
    cut: fc.option(fc.nat(40), { freq: 3 }),
    as: fc.constantFrom('serial', 'iso') as fc.Arbitrary<'serial' | 'iso'>,
    coverage: fc.oneof(fc.constantFrom(null, 0.9, 0.5, 0.99, 1, 0, -1, 2), cell),
  });

  it('ahead and band on valid ranges with a few cells damaged spill finite numbers or give an InputError', () => {
    const { market, stored } = fixture();
    fc.assert(fc.property(damaged, ({ damage, cut, as, coverage }) => {
      const t = oneTable(market, as);
      const ranges: Record<string, unknown[][]> = { times: t.times.map((r) => [...r]), prices: t.prices.map((r) => [...r]), drivers: t.drivers.map((r) => [...r]) };
      for (const [at, which, v] of damage) ranges[which][at % ranges[which].length][0] = v;
      if (cut !== null) for (const k of Object.keys(ranges)) ranges[k] = ranges[k].slice(0, ranges[k].length - cut);
      const args = { times: ranges.times, prices: ranges.prices, drivers: ranges.drivers };
      const a = outcome(() => ahead(stored, args));
      if (a.ok) expect(finiteGrid(a.value), JSON.stringify(a.value).slice(0, 200)).toBe(true);
      const b = outcome(() => band(stored, args, coverage));
      if (b.ok) {
        expect(finiteGrid(b.value)).toBe(true);
        for (const [lo, hi] of b.value) expect(lo).toBeLessThanOrEqual(hi);
      }
    }), params(25, 86));
  });

  it('explain on valid ranges with a few cells damaged spills group names with finite contributions, or gives an InputError', () => {
    const { market, stored } = fixture();
    fc.assert(fc.property(damaged, fc.oneof(fc.constantFrom(null, 'd-1', 'd-7', 'D-7', 'd-2'), cell), ({ damage, cut, as }, against) => {
      const t = oneTable(market, as);
      const ranges: Record<string, unknown[][]> = { times: t.times.map((r) => [...r]), prices: t.prices.map((r) => [...r]), drivers: t.drivers.map((r) => [...r]) };
      for (const [at, which, v] of damage) ranges[which][at % ranges[which].length][0] = v;
      if (cut !== null) for (const k of Object.keys(ranges)) ranges[k] = ranges[k].slice(0, ranges[k].length - cut);
      const got = outcome(() => explain(stored, { times: ranges.times, prices: ranges.prices, drivers: ranges.drivers }, against));
      if (got.ok) for (const [group, value] of got.value) { expect(typeof group).toBe('string'); expect(Number.isFinite(value)).toBe(true); }
    }), params(15, 89));
  });

  it('ahead and band on random ranges give an InputError, not a fault', () => {
    const { stored } = fixture();
    fc.assert(fc.property(range, range, fc.option(range, { nil: undefined }), fc.option(range, { nil: undefined }), (times, prices, driverTimes, drivers) => {
      const a = outcome(() => ahead(stored, { times, prices, driverTimes, drivers }));
      if (a.ok) expect(finiteGrid(a.value)).toBe(true);
      const b = outcome(() => band(stored, { times, prices, driverTimes, drivers }, null));
      if (b.ok) expect(finiteGrid(b.value)).toBe(true);
    }), params(400, 87));
  });

  it('modelFacts(stored, field) answers every field name and refuses others', () => {
    const { stored } = fixture();
    fc.assert(fc.property(fc.oneof(fc.constantFrom(...MODEL_FIELDS, null, ''), cell), (field) => {
      const got = outcome(() => modelFacts(stored, field));
      if (got.ok) for (const row of got.value) for (const v of row) expect(typeof v === 'string' || Number.isFinite(v)).toBe(true);
    }), params(300, 88));
  });
});

describe('an empty drivers array (src/functions/ranges-to-series.ts)', () => {
  it('ahead(stored, { times, prices, drivers: [] }) gives an InputError, not a TypeError', () => {
    const { stored } = fixture();
    expect(outcome(() => ahead(stored, { times: [['']], prices: '', drivers: [] })).ok).toBe(false);
  });
});
