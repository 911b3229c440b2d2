import { describe, expect, it } from 'vitest';
import { mae, rmae } from '../../src/engine';
import type { CellValue } from '../../src/host/workbook-port';
import { calculate, Failure, type CellSource, type FormulaCell, type ResultCache } from '../../src/preview/formula-eval';
import { LOOM_FUNCTIONS, type LoomFunction } from '../../src/preview/loom-functions';

/** A workbook of sheets (each grid from A1) as the evaluator reads it, with version numbers for the cache. */
function source(sheets: Record<string, CellValue[][]>, versions: Record<string, number> = {}, models = { v: 0 }): CellSource {
  const find = (name: string) => Object.keys(sheets).find((s) => s.toLowerCase() === name.toLowerCase());
  return {
    sheetName: find,
    raw: (sheet, row, column) => {
      const v = sheets[find(sheet)!]?.[row]?.[column];
      return v === null || v === undefined || v === '' ? undefined : v;
    },
    formulas: () => Object.entries(sheets).flatMap(([sheet, grid]) => grid.flatMap((line, row) => line.flatMap((v, column): FormulaCell[] =>
      typeof v === 'string' && v.startsWith('=') ? [{ sheet, row, column, formula: v }] : []))),
    version: (sheet) => versions[sheet.toLowerCase()] ?? 0,
    modelsVersion: () => models.v,
  };
}

const calls: string[] = [];
/** Small stand-in functions: SEQ(n) spills 1..n down, SUM adds a range, FAIL throws the host's error shape. */
const FAKE: Record<string, LoomFunction> = {
  SEQ: { call: (async (n: number) => { calls.push('SEQ'); return Array.from({ length: n }, (_, i) => [i + 1]); }) as never, params: ['scalar'], required: 1 },
  SUM: { call: (async (g: CellValue[][]) => { calls.push('SUM'); return g.flat().reduce<number>((a, v) => a + (typeof v === 'number' ? v : 0), 0); }) as never, params: ['matrix'], required: 1 },
  FAIL: { call: (async () => { throw Object.assign(new Error('bad input here'), { code: '#VALUE!' }); }) as never, params: [], required: 0 },
  NAMED: { call: (async () => { calls.push('NAMED'); return 'model answer'; }) as never, params: [], required: 0, readsModels: true },
};

describe('calculate(source, functions, cache)', () => {
  it('a plain reference gives the cell, a range spills into the empty cells beside it', async () => {
    const calc = await calculate(source({ S: [[1, 2, '=A1', '=A1:B2'], [3, 4]] }), FAKE);
    expect(calc.result('S', 0, 2)).toEqual({ value: 1 });
    expect(calc.result('S', 0, 3)).toEqual({ value: 1, spill: { rows: 2, columns: 2 } });
    expect([calc.spilled('S', 0, 4), calc.spilled('S', 1, 3), calc.spilled('S', 1, 4)]).toEqual([2, 3, 4]);
    expect(calc.touches('s')).toBe(true);
  });

  it('a reference reads a spill computed later in sheet order (formulas that could spill into it go first)', async () => {
    const calc = await calculate(source({ S: [['=LOOM.SUM(C3:C5)'], [], [null, null, '=LOOM.SEQ(3)']] }), FAKE);
    expect(calc.result('S', 0, 0)?.value).toBe(1 + 2 + 3);
  });

  it('a spill onto a written cell shows #SPILL! and spills nothing', async () => {
    const calc = await calculate(source({ S: [['=LOOM.SEQ(3)'], [], ['taken']] }), FAKE);
    expect(calc.result('S', 0, 0)?.error?.code).toBe('#SPILL!');
    expect(calc.result('S', 0, 0)?.error?.message).toMatch(/needs A1:A3 .* but A3 is not empty/);
    expect(calc.spilled('S', 1, 0)).toBeUndefined();
  });

  it('errors: the function\'s own error value and message, #NAME? for unknown names, #REF! for a cycle or a missing sheet, passed on by references', async () => {
    const calc = await calculate(source({ S: [['=LOOM.FAIL()', '=A1', '=LOOM.NOPE(1)', '=D1', '=Nope!A1', '=SUM(A1)', '=NOPE(1)', '=1 +', '=IFERROR(LOOM.FAIL(), "none")']] }), FAKE);
    expect(calc.result('S', 0, 0)?.error).toEqual({ code: '#VALUE!', message: 'bad input here' });
    expect(calc.result('S', 0, 1)?.error?.code).toBe('#VALUE!');
    expect(calc.result('S', 0, 1)?.error?.message).toMatch(/^S!A1 shows #VALUE!/);
    expect(calc.result('S', 0, 2)?.error?.code).toBe('#NAME?');
    expect(calc.result('S', 0, 3)?.error).toMatchObject({ code: '#REF!', message: expect.stringMatching(/circular/) });
    expect(calc.result('S', 0, 4)?.error?.message).toMatch(/sheet "Nope"/);
    expect(calc.result('S', 0, 5)?.error).toMatchObject({ code: '#VALUE!', message: expect.stringMatching(/^S!A1 shows #VALUE!/) });
    expect(calc.result('S', 0, 6)?.error).toEqual({ code: '#NAME?', message: 'NOPE is not a function the preview knows' });
    expect(calc.result('S', 0, 7)?.error).toMatchObject({ code: '#NAME?', message: expect.stringMatching(/^cannot read the formula/) });
    expect(calc.result('S', 0, 8)).toEqual({ value: 'none' });
  });

  it('an error in a cell or range fails the formula that reads it, never a number that skips it; IFERROR and ISERROR see it', async () => {
    const calc = await calculate(source({ S: [[1, '=LOOM.FAIL()', '=SUM(A1:B1)', '=MAX(A1:B1)', '=LOOM.SUM(A1:B1)', '=SUM(A1, B1)', '=IFERROR(B1, 0) + A1', '=ISERROR(B1)']] }), FAKE);
    for (const c of [2, 3, 4, 5]) expect(calc.result('S', 0, c)?.error).toMatchObject({ code: '#VALUE!', message: expect.stringMatching(/^S!B1 shows #VALUE!: bad input here/) });
    expect(calc.result('S', 0, 6)).toEqual({ value: 1 });
    expect(calc.result('S', 0, 7)).toEqual({ value: true });
  });

  it('argument checks: too many, a missing required one, a range where one cell belongs', async () => {
    const calc = await calculate(source({ S: [['=LOOM.SEQ(1, 2)', '=LOOM.SUM()', '=LOOM.SEQ(A2:A3)'], [1], [2]] }), FAKE);
    expect(calc.result('S', 0, 0)?.error?.message).toMatch(/takes at most 1 argument, got 2/);
    expect(calc.result('S', 0, 1)?.error?.message).toMatch(/needs at least 1 argument;/);
    expect(calc.result('S', 0, 2)?.error?.message).toMatch(/must be one cell or value, not 2 × 1 cells/);
  });

  it('LOOM.SCORE through the real cell function equals the engine\'s MAE and rMAE; an empty cell is skipped as unknown', async () => {
    const actual = [10, 12, null, 15, 9], forecast = [11, 12, 13, 13, 10], reference = [9, 14, 11, 15, 12];
    const sheet: CellValue[][] = actual.map((a, i) => [a, forecast[i], reference[i]]);
    sheet[0].push('=LOOM.SCORE(A1:A5, B1:B5, "MAE")', '=LOOM.SCORE(A1:A5, B1:B5, "RMAE", C1:C5)', '=LOOM.SCORE(A1:A5, B1:B5, "nope")');
    const calc = await calculate(source({ S: sheet }), LOOM_FUNCTIONS);
    const nan = (xs: (number | null)[]) => xs.map((x) => (x === null ? NaN : x));
    expect(calc.result('S', 0, 3)?.value).toBeCloseTo(mae(nan(actual), forecast), 12);
    expect(calc.result('S', 0, 4)?.value).toBeCloseTo(rmae(nan(actual), forecast, reference), 12);
    expect(calc.result('S', 0, 5)?.error).toMatchObject({ code: '#VALUE!', message: expect.stringMatching(/unknown metric "NOPE"/) });
  });

  it('with a cache, a formula is computed again only when a sheet it read (or, for model readers, the models) changed', async () => {
    const cache: ResultCache = new Map();
    const versions: Record<string, number> = { s: 1, other: 1 };
    const models = { v: 0 };
    const sheets = { S: [[1, 2, '=LOOM.SUM(A1:B1)', '=LOOM.NAMED()']], Other: [[5]] };
    calls.length = 0;
    await calculate(source(sheets, versions, models), FAKE, cache);
    await calculate(source(sheets, versions, models), FAKE, cache);
    expect(calls).toEqual(['SUM', 'NAMED']);
    versions.other = 2; // not read by either
    await calculate(source(sheets, versions, models), FAKE, cache);
    expect(calls).toEqual(['SUM', 'NAMED']);
    models.v = 1;
    await calculate(source(sheets, versions, models), FAKE, cache);
    expect(calls).toEqual(['SUM', 'NAMED', 'NAMED']);
    versions.s = 2;
    const calc = await calculate(source({ S: [[4, 2, '=LOOM.SUM(A1:B1)', '=LOOM.NAMED()']], Other: [[5]] }, versions, models), FAKE, cache);
    expect(calls).toEqual(['SUM', 'NAMED', 'NAMED', 'SUM', 'NAMED']);
    expect(calc.result('S', 0, 2)?.value).toBe(6);
  });

  it('Failure carries the error value it shows', () => {
    // (kept from the hand-written evaluator: the error shape the grid shows)
    const f = new Failure('#NUM!', 'too big');
    expect([f.code, f.message]).toEqual(['#NUM!', 'too big']);
  });
});

// What a desk puts around LOOM results, evaluated by the formula libraries
// (fast-formula-parser, @formulajs/formulajs). Expected values follow the
// spreadsheet's documented rules, from memory: blank cells are left out of
// SUM/AVERAGE/MIN/MAX and text in a range is ignored by them; ROUND rounds
// half away from zero; =A1 of an empty cell shows 0; MIN/MAX of no number is 0.
describe('calculate: arithmetic, references and the common functions', () => {
  const grid: CellValue[][] = [
    [10, 20, null, 'text', -2.5],
    [2.5, 4, 6, 8, 0.125],
  ];
  const at = async (formula: string) => {
    const sheets = { S: [...grid.map((r) => r.slice()), [formula]] };
    const calc = await calculate(source(sheets), FAKE);
    return calc.result('S', 2, 0);
  };

  it.each([
    ['=A1+B1*2', 50],
    ['=(A1+B1)*2', 60],
    ['=2^10-A2', 1021.5],
    ['=A1/B1', 0.5],
    ['=-A1+E1', -12.5],
    ['=A1&"/"&D1', '10/text'],
    ['=A1>B1', false],
    ['=C1', 0],
    ['=SUM(A1:E2)', 10 + 20 - 2.5 + 2.5 + 4 + 6 + 8 + 0.125],
    ['=AVERAGE(A1:C1)', 15],
    ['=MIN(A1:E1)', -2.5],
    ['=MAX(A1:E2)', 20],
    ['=MAX(C1:D1)', 0],
    ['=ROUND(2.5, 0)', 3],
    ['=ROUND(-2.5, 0)', -3],
    ['=ROUND(E2, 2)', 0.13],
    ['=ROUND(AVERAGE(A2:E2), 1)', 4.1],
    ['=IF(A1>B1, "up", "down")', 'down'],
    ['=IF(E1<0, ABS(E1), E1)', 2.5],
    ['=ABS(-A2)', 2.5],
    ['=SUM(A1:B1) - LOOM.SUM(A2:B2)', 30 - 6.5],
    ['=ROUND(LOOM.SUM(A1:E2) / 9, 2)', 5.35],
    ['=S!A1 * 3', 30],
  ] as [string, CellValue][])('%s gives %s', async (formula, expected) => {
    const r = await at(formula);
    expect(r?.error).toBeUndefined();
    if (typeof expected === 'number') expect(r?.value as number).toBeCloseTo(expected, 12);
    else expect(r?.value).toBe(expected);
  });

  it('division by zero shows #DIV/0!; a LOOM spill can be wrapped: =LOOM.SEQ(3) spills, SUM(LOOM.SEQ(3)) adds it', async () => {
    expect((await at('=A1/0'))?.error?.code).toBe('#DIV/0!');
    expect(await at('=SUM(LOOM.SEQ(3))')).toEqual({ value: 6 });
    const calc = await calculate(source({ S: [['=LOOM.SEQ(3)', '=SUM(A1:A3)']] }), FAKE);
    expect(calc.result('S', 0, 0)).toEqual({ value: 1, spill: { rows: 3, columns: 1 } });
    expect(calc.result('S', 0, 1)).toEqual({ value: 6 });
  });
});
