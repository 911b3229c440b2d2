import { afterEach, describe, expect, it } from 'vitest';
import { storedModelText } from '../../src/engine';
import { ahead, band, baseline, compare, holiday, model, score } from '../../src/functions/functions';
import { ahead as aheadCore } from '../../src/functions/ahead';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { bindWorkbook, ModelStore, unbindWorkbook } from '../../src/host/model-store';
import type { WorkbookPort } from '../../src/host/workbook-port';
import { fixture, oneTable } from './fixture';

async function workbookWithModel(dateSystem: '1900' | '1904' = '1900'): Promise<MemoryWorkbook> {
  const wb = new MemoryWorkbook({ dateSystem });
  await new ModelStore(wb).saveText(storedModelText(fixture().stored));
  bindWorkbook(wb);
  return wb;
}

afterEach(() => unbindWorkbook());

describe('LOOM functions (functions.ts)', () => {
  it('AHEAD(model, times, prices, , drivers) finds the saved model and spills its forecast', async () => {
    await workbookWithModel();
    const { market, stored } = fixture();
    const t = oneTable(market);
    const out = await ahead('test-linear', t.times, t.prices, undefined, t.drivers);
    expect(out).toEqual(aheadCore(stored, t));
  });

  it('AHEAD with an unknown model name is #VALUE! naming the saved models', async () => {
    await workbookWithModel();
    const t = oneTable(fixture().market);
    await expect(ahead('nope', t.times, t.prices, undefined, t.drivers)).rejects.toMatchObject({
      code: '#VALUE!', message: expect.stringMatching(/no model named "nope".*"test-linear"/),
    });
  });

  it('BAND(..., coverage) spills two columns', async () => {
    await workbookWithModel();
    const t = oneTable(fixture().market);
    const out = await band('test-linear', t.times, t.prices, undefined, t.drivers, 0.8);
    expect(out).toHaveLength(25);
    expect(out.every((r) => r.length === 2 && r[0] < r[1])).toBe(true);
  });

  it('BAND with a coverage in percent is #VALUE!, never a number', async () => {
    await workbookWithModel();
    const t = oneTable(fixture().market);
    await expect(band('test-linear', t.times, t.prices, undefined, t.drivers, 90)).rejects.toMatchObject({ code: '#VALUE!' });
  });

  it('BASELINE, SCORE and COMPARE need no saved model', async () => {
    const t = oneTable(fixture().market);
    expect(await baseline(t.times, t.prices, 'day')).toHaveLength(25);
    expect(await score([[1], [3]], [[2], [3]])).toBe(0.5);
    expect(await compare([[10], [20], [10], [20], [10], [20]], [[11], [20], [10], [21], [12], [20]], [[13], [18], [14], [20], [10], [25]], 'abs', [[2]])).toBeLessThan(0.05);
    await expect(score([['x']], [[1]])).rejects.toMatchObject({ code: '#VALUE!', message: expect.stringMatching(/"x" is not a number/) });
  });

  it('HOLIDAY reads serials in the bound workbook\'s date system', async () => {
    expect(await holiday(45933, 'DE')).toBe('Tag der Deutschen Einheit');
    await workbookWithModel('1904');
    expect(await holiday(45933 - 1462, 'DE')).toBe('Tag der Deutschen Einheit');
  });

  it('MODEL(model, field) gives a fact; without a field, the table', async () => {
    await workbookWithModel();
    expect(await model('test-linear', 'trained_to')).toEqual([['2025-10-25']]);
    expect((await model('test-linear')).length).toBeGreaterThan(10);
  });

  it('a workbook that fails underneath gives #N/A with a note, not a number', async () => {
    const broken = { ...new MemoryWorkbook(), kind: 'memory', loadModels: async () => { throw new Error('disk on fire'); } } as unknown as WorkbookPort;
    bindWorkbook(broken);
    await expect(model('x', 'name')).rejects.toMatchObject({ code: '#N/A', message: expect.stringMatching(/disk on fire/) });
  });
});
