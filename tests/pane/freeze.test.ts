import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import type { CellValue } from '../../src/host/workbook-port';
import { freezeLines, freezeQuestion, freezeSheets, freezeTargets } from '../../src/pane/logic/freeze';
import type { LoomFunction } from '../../src/preview/loom-functions';
import { PreviewWorkbook } from '../../src/preview/preview-workbook';

// The host's rule emulated here (from memory, as in the preview's evaluator):
// a dynamic-array formula fills its own cell and spills into the empty cells
// below and to the right; reading a spilled cell gives its value.

/** Stand-in LOOM functions: SEQ(n) spills 1..n down, TWO spills two columns, FAIL shows #VALUE!. */
const FAKE: Record<string, LoomFunction> = {
  SEQ: { call: (async (n: number) => Array.from({ length: n }, (_, i) => [i + 1])) as never, params: ['scalar'], required: 1 },
  TWO: { call: (async () => [[10, 20], [11, 21]]) as never, params: [], required: 0 },
  FAIL: { call: (async () => { throw Object.assign(new Error('no model'), { code: '#VALUE!' }); }) as never, params: [], required: 0 },
};

function workbook(sheets: Record<string, CellValue[][]>): PreviewWorkbook {
  return new PreviewWorkbook({ sheets, functions: FAKE });
}

/** Every formula left anywhere in the workbook that calls a LOOM function. */
async function loomLeft(port: PreviewWorkbook): Promise<string[]> {
  const left: string[] = [];
  for (const sheet of await port.listSheets()) {
    const used = await port.usedAddress(sheet);
    if (!used) continue;
    for (const row of await port.readFormulas(used)) for (const v of row) if (typeof v === 'string' && /^=.*LOOM\./i.test(v)) left.push(`${sheet}: ${v}`);
  }
  return left;
}

describe('freezeTargets(typed, sheets)', () => {
  it('all sheets when nothing is typed; typed names in the workbook\'s own spelling, once each', () => {
    expect(freezeTargets(' ', ['History', 'Outlook'])).toEqual(['History', 'Outlook']);
    expect(freezeTargets('outlook, OUTLOOK ,Forecast', ['History', 'Outlook', 'Forecast'])).toEqual(['Outlook', 'Forecast']);
  });

  it('refuses a sheet the workbook does not have, naming the ones it has', () => {
    expect(() => freezeTargets('Outlok', ['History', 'Outlook'])).toThrow('the workbook has no sheet named "Outlok" (sheets: History, Outlook)');
  });
});

describe('freezeSheets(port, ask, sheets)', () => {
  const sheets = () => ({
    History: [['t', 'p'], [1, 40]],
    Outlook: [['start', 'forecast', 'band', '', 'kept'], ['00:00', '=LOOM.SEQ(3)', '=LOOM.TWO()', null, '=SUM(B2:B4)'], ['01:00'], ['02:00', null, '=B3:C3']],
    Forecast: [['=LOOM.FAIL()', '=ROUND(LOOM.SEQ(1) * 2.5, 0)']],
  });

  it('asks once, naming every sheet and its count; on no changes nothing', async () => {
    const port = workbook(sheets());
    await port.settled();
    const before = [port.grid('Outlook'), port.grid('Forecast')];
    const questions: string[] = [];
    expect(await freezeSheets(port, async (q) => { questions.push(q); return false; }, ['History', 'Outlook', 'Forecast'])).toBeUndefined();
    expect(questions).toEqual(['Replace the 4 LOOM formulas on the sheets Outlook (2), Forecast (2) by their current values? The cells then hold fixed numbers that no longer update, and the workbook opens without the add-in.']);
    expect([port.grid('Outlook'), port.grid('Forecast')]).toEqual(before);
  });

  it('on yes no LOOM formula is left: each becomes its values, spilled cells too; other formulas stay and compute on them', async () => {
    const port = workbook(sheets());
    const done = await freezeSheets(port, async () => true, await port.listSheets());
    expect(done).toEqual([
      { sheet: 'Outlook', formulas: ['B2', 'C2'], cells: 3 + 4, errors: [] },
      { sheet: 'Forecast', formulas: ['A1', 'B1'], cells: 2, errors: ['A1'] },
    ]);
    expect(await loomLeft(port)).toEqual([]);
    expect(await port.readFormulas('Outlook!B2:E4')).toEqual([[1, 10, 20, '=SUM(B2:B4)'], [2, 11, 21, null], [3, '=B3:C3', 11, null]]);
    expect(await port.readRange('Outlook!E2')).toEqual([[6]]);
    // a kept formula that spills among the frozen cells (C4 into D4) still spills: D4 was left empty, not written
    expect(port.grid('Outlook')[3].slice(2, 4)).toEqual(['=B3:C3', null]);
    expect(port.cell('Outlook', 3, 2).result).toEqual({ value: 2, spill: { rows: 1, columns: 2 } });
    // a formula that wraps a LOOM call is a LOOM formula: it is frozen to what it shows
    expect(await port.readFormulas('Forecast!A1:B1')).toEqual([['#VALUE!', 3]]);
  });

  it('only the sheets named; nobody is asked when they hold no LOOM formula', async () => {
    const port = workbook(sheets());
    let asked = 0;
    expect(await freezeSheets(port, async () => { asked++; return true; }, ['History'])).toEqual([]);
    expect(asked).toBe(0);
    await freezeSheets(port, async () => true, ['Forecast']);
    expect((await loomLeft(port)).map((l) => l.split(':')[0])).toEqual(['Outlook', 'Outlook']);
  });

  it('the plain memory workbook (no evaluator) freezes each cell alone', async () => {
    const port = new MemoryWorkbook({ sheets: { S: [['=LOOM.AHEAD("m", A1:A9, B1:B9)', '=SUM(C1:C2)']] }, evaluate: () => 42 });
    expect(await freezeSheets(port, async () => true, ['S'])).toEqual([{ sheet: 'S', formulas: ['A1'], cells: 1, errors: [] }]);
    expect(await port.readFormulas('S!A1:B1')).toEqual([[42, '=SUM(C1:C2)']]);
  });

  it('stops before writing anything while a LOOM cell is still computing', async () => {
    const port = new MemoryWorkbook({ sheets: { S: [['=LOOM.AHEAD("m", A1:A9, B1:B9)']] }, evaluate: () => '#BUSY!' });
    await expect(freezeSheets(port, async () => true, ['S'])).rejects.toThrow('S!A1 is still computing (#BUSY!); wait until every LOOM cell shows its result, then freeze');
    expect(await port.readFormulas('S!A1')).toEqual([['=LOOM.AHEAD("m", A1:A9, B1:B9)']]);
  });
});

describe('freezeQuestion and freezeLines', () => {
  it('singular for one formula on one sheet; long lists are cut with a count', () => {
    expect(freezeQuestion([{ sheet: 'Outlook', formulas: ['B13'], cells: 24, errors: [] }])).toMatch(/^Replace the 1 LOOM formula on the sheet Outlook \(1\) by its current values\?/);
    const many = Array.from({ length: 10 }, (_, i) => `B${i + 1}`);
    expect(freezeLines([{ sheet: 'S', formulas: many, cells: 1, errors: ['B2'] }])).toEqual([
      'S: 10 LOOM formulas (B1, B2, B3, B4, B5, B6, B7, B8 and 2 more), 1 cell now fixed values; 1 showed an error and now holds its text (B2)',
    ]);
  });
});
