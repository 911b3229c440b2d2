import { afterEach, describe, expect, it } from 'vitest';
import { explainAhead, learnerFromStored, storedModelText } from '../../src/engine';
import { explain as explainCore } from '../../src/functions/explain';
import { explain } from '../../src/functions/functions';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { bindWorkbook, ModelStore, unbindWorkbook } from '../../src/host/model-store';
import { fixture, oneTable } from './fixture';
import { seriesOf } from './synthetic';

afterEach(() => unbindWorkbook());

describe('explain(stored, ranges, against)', () => {
  it('spills group and contribution, largest first, adding up to the engine\'s change of the mean forecast', () => {
    const { market, stored } = fixture();
    const out = explainCore(stored, oneTable(market), null);
    const engine = explainAhead(learnerFromStored(stored), seriesOf(market, true), ['temp'], 'd-1');
    expect(engine.day).toBe('2025-10-26');
    expect(out).toHaveLength(engine.contributions.length);
    expect(out.every((r) => r.length === 2 && typeof r[0] === 'string' && typeof r[1] === 'number')).toBe(true);
    const sum = out.reduce((s, r) => s + (r[1] as number), 0);
    expect(Math.abs(sum - engine.change)).toBeLessThanOrEqual(1e-9 * Math.abs(engine.change));
    const sizes = out.map((r) => Math.abs(r[1] as number));
    expect(sizes).toEqual([...sizes].sort((a, b) => b - a));
    expect(Object.fromEntries(out)).toEqual(Object.fromEntries(engine.contributions.map((c) => [c.group, c.value])));
  });

  it('against "d-7" compares with the same weekday: its weekday row is exactly 0', () => {
    const { market, stored } = fixture();
    const out = explainCore(stored, oneTable(market), 'D-7');
    expect(out.find((r) => r[0] === 'weekday')![1]).toBe(0);
  });

  it('refuses a reference day other than d-1 or d-7, and missing drivers, with what to fix', () => {
    const { market, stored } = fixture();
    expect(() => explainCore(stored, oneTable(market), 'd-2')).toThrow(/against must be "d-1" \(the day before\) or "d-7"/);
    const { times, prices } = oneTable(market);
    expect(() => explainCore(stored, { times, prices }, null)).toThrow(/was trained with the driver temp: give their range/);
  });
});

describe('LOOM.EXPLAIN (functions.ts)', () => {
  it('finds the saved model and spills; a bad argument is #VALUE!, never a number', async () => {
    const wb = new MemoryWorkbook();
    await new ModelStore(wb).saveText(storedModelText(fixture().stored));
    bindWorkbook(wb);
    const t = oneTable(fixture().market);
    const out = await explain('test-linear', t.times, t.prices, undefined, t.drivers);
    expect(out).toEqual(explainCore(fixture().stored, t, undefined));
    await expect(explain('test-linear', t.times, t.prices, undefined, t.drivers, 'yesterday')).rejects.toMatchObject({ code: '#VALUE!' });
  });
});
