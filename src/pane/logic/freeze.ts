import { InputError } from '../../engine';
import { formatA1, parseA1 } from '../../host/a1';
import { writeWithConsent } from '../../host/safe-write';
import type { AskUser, CellValue, WorkbookPort } from '../../host/workbook-port';
import { isLoomFormula } from './formula-text';

/**
 * "Freeze to values": every LOOM formula of the named sheets (all sheets by
 * default) becomes the values it shows now, in its own cell and in the cells
 * it spills into, so that the workbook opens and reads the same without the
 * add-in. Other formulas (a plain `=SUM(...)`) stay formulas: they compute
 * in any spreadsheet, now on the frozen numbers. Cells outside the LOOM
 * results are never written.
 *
 * A LOOM cell that shows an error is frozen as that error text and counted,
 * so the list says where to look; a cell still computing (#BUSY!) stops the
 * freeze before anything is written.
 */

/** What freezing does, or did, on one sheet. */
export interface SheetFreeze {
  sheet: string;
  /** the LOOM formula cells, e.g. ['B13', 'C13'] */
  formulas: string[];
  /** cells written: the formula cells and the cells they spill into */
  cells: number;
  /** LOOM cells that showed an error value (frozen as its text) */
  errors: string[];
}

interface Area {
  address: string;
  values: CellValue[][];
}

/** Error values a cell can show (ECMA-376 Part 1, 18.17.3, plus the host's dynamic-array ones, from memory). */
const ERROR_VALUE = /^#(NULL!|DIV\/0!|VALUE!|REF!|NAME\?|NUM!|N\/A|SPILL!|CALC!|BUSY!|GETTING_DATA|CONNECT!|BLOCKED!|FIELD!|UNKNOWN!)$/;
const STILL_COMPUTING = new Set(['#BUSY!', '#GETTING_DATA']);

/**
 * The sheets a freeze covers: the names typed (comma-separated, any case),
 * or every sheet of the workbook when none is typed.
 *
 * @throws InputError naming a sheet the workbook does not have
 * @example freezeTargets('outlook, Forecast', ['History', 'Outlook', 'Forecast']) // ['Outlook', 'Forecast']
 */
export function freezeTargets(typed: string, sheets: string[]): string[] {
  const names = typed.split(',').map((s) => s.trim()).filter(Boolean);
  if (names.length === 0) return sheets.slice();
  return [...new Set(names.map((name) => {
    const hit = sheets.find((s) => s.toLowerCase() === name.toLowerCase());
    if (!hit) throw new InputError(`the workbook has no sheet named "${name}" (sheets: ${sheets.join(', ')})`);
    return hit;
  }))];
}

/**
 * Reads what freezing `sheets` would write: per sheet, the LOOM cells and
 * one block, the smallest rectangle around the ranges they fill. Inside it,
 * a LOOM range gets its values; every other cell keeps what is written
 * there, and a cell that another (kept) formula spills into is left empty,
 * so that formula spills into it again. One write per sheet: the host (and
 * the preview) recalculates once, not once per formula.
 */
async function planFreeze(port: WorkbookPort, sheets: string[]): Promise<{ sheet: SheetFreeze; area: Area }[]> {
  const plan: { sheet: SheetFreeze; area: Area }[] = [];
  for (const name of sheets) {
    const used = await port.usedAddress(name);
    if (!used) continue;
    const r = parseA1(used);
    const formulas = await port.readFormulas(used);
    const all: { address: string; local: string; loom: boolean }[] = [];
    formulas.forEach((row, i) => row.forEach((f, j) => {
      if (typeof f !== 'string' || !f.startsWith('=')) return;
      const at = { row: r.row + i, column: r.column + j, rows: 1, columns: 1 };
      all.push({ address: formatA1({ ...at, sheet: name }), local: formatA1(at), loom: isLoomFormula(f) });
    }));
    const loom = all.filter((c) => c.loom);
    if (loom.length === 0) continue;
    const ranges = (await port.spillRanges(all.map((c) => c.address))).map((a) => parseA1(a));
    const loomRanges = ranges.filter((_, k) => all[k].loom);
    const top = Math.min(...loomRanges.map((x) => x.row)), left = Math.min(...loomRanges.map((x) => x.column));
    const bottom = Math.max(...loomRanges.map((x) => x.row + x.rows)), right = Math.max(...loomRanges.map((x) => x.column + x.columns));
    const box = { sheet: name, row: top, column: left, rows: bottom - top, columns: right - left };
    const block: CellValue[][] = Array.from({ length: box.rows }, (_, i) => Array.from({ length: box.columns }, (_, j) => formulas[top - r.row + i]?.[left - r.column + j] ?? null));
    const put = (x: { row: number; column: number; rows: number; columns: number }, cell: (i: number, j: number) => CellValue) => {
      for (let i = 0; i < x.rows; i++) for (let j = 0; j < x.columns; j++) {
        const bi = x.row + i - top, bj = x.column + j - left;
        if (bi >= 0 && bj >= 0 && bi < box.rows && bj < box.columns) block[bi][bj] = cell(i, j);
      }
    };
    // kept formulas: their spilled cells read as values, but must stay empty for the formula to spill again
    ranges.forEach((x, k) => { if (!all[k].loom) put(x, (i, j) => (i === 0 && j === 0 ? block[x.row - top]?.[x.column - left] ?? null : null)); });
    const errors: string[] = [];
    let cells = 0;
    for (let k = 0; k < loom.length; k++) {
      const values = await port.readRange(formatA1({ ...loomRanges[k], sheet: name }));
      const shown = values[0]?.[0];
      if (typeof shown === 'string' && STILL_COMPUTING.has(shown)) {
        throw new InputError(`${loom[k].address} is still computing (${shown}); wait until every LOOM cell shows its result, then freeze`);
      }
      if (typeof shown === 'string' && ERROR_VALUE.test(shown)) errors.push(loom[k].local);
      put(loomRanges[k], (i, j) => values[i]?.[j] ?? null);
      cells += loomRanges[k].rows * loomRanges[k].columns;
    }
    plan.push({ sheet: { sheet: name, formulas: loom.map((c) => c.local), cells, errors }, area: { address: formatA1(box), values: block } });
  }
  return plan;
}

/** The one question asked before freezing. */
export function freezeQuestion(sheets: SheetFreeze[]): string {
  const n = sheets.reduce((s, x) => s + x.formulas.length, 0);
  const where = sheets.map((s) => `${s.sheet} (${s.formulas.length})`).join(', ');
  return `Replace the ${n} LOOM formula${n === 1 ? '' : 's'} on ${sheets.length === 1 ? 'the sheet' : 'the sheets'} ${where} by ${n === 1 ? 'its' : 'their'} current values? `
    + 'The cells then hold fixed numbers that no longer update, and the workbook opens without the add-in.';
}

/**
 * Freezes the LOOM formulas of `sheets` after asking once (the question
 * names every sheet and how many formulas it holds). Nobody is asked, and
 * nothing written, when there is no LOOM formula.
 *
 * @returns what was frozen per sheet (empty: nothing there), or undefined when the user said no
 * @throws InputError when a LOOM cell is still computing
 */
export async function freezeSheets(port: WorkbookPort, ask: AskUser, sheets: string[]): Promise<SheetFreeze[] | undefined> {
  const plan = await planFreeze(port, sheets);
  if (plan.length === 0) return [];
  if (!(await ask(freezeQuestion(plan.map((p) => p.sheet))))) return undefined;
  // the user has answered for every cell named in the question; each block goes through the one write path all the same
  for (const { area } of plan) await writeWithConsent(port, async () => true, area.address, area.values);
  return plan.map((p) => p.sheet);
}

/** One line per frozen sheet for the pane's list. */
export function freezeLines(done: SheetFreeze[]): string[] {
  return done.map((s) => {
    const shown = s.formulas.length > 8 ? `${s.formulas.slice(0, 8).join(', ')} and ${s.formulas.length - 8} more` : s.formulas.join(', ');
    const errors = s.errors.length ? `; ${s.errors.length} showed an error and now ${s.errors.length === 1 ? 'holds' : 'hold'} its text (${s.errors.join(', ')})` : '';
    return `${s.sheet}: ${s.formulas.length} LOOM formula${s.formulas.length === 1 ? '' : 's'} (${shown}), ${s.cells} cell${s.cells === 1 ? '' : 's'} now fixed values${errors}`;
  });
}
