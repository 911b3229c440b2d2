import { InputError } from '../engine';
import { formatA1 } from '../host/a1';
import type { CellValue } from '../host/workbook-port';
import { FormulaEngine, FormulaError, type CellReader, type Reference } from './formula-engine';
import { LOOM_FUNCTIONS, type LoomFunction } from './loom-functions';

/**
 * The preview grid's recalculation: computes every formula cell of a
 * workbook once (a full recalculation), with spills as dynamic arrays have
 * them. Each formula is read and evaluated by the formula libraries
 * (formula-engine.ts: arithmetic, references, SUM, AVERAGE, ROUND, IF, …,
 * and the LOOM functions through the custom-function hook); this file keeps
 * what a workbook adds around single formulas. A formula whose result has
 * several cells writes the top-left one in its own cell and spills the rest
 * into the cells below and to the right, which must be empty (else its cell
 * shows #SPILL!). References read values: a formula cell gives its result, a
 * spilled cell its spilled value, an empty cell null. A formula that refers
 * to a cell showing an error shows that error (unless it handles errors with
 * IFERROR and the like); one that refers to itself, directly or through
 * others, #REF!.
 *
 * Order: cells are computed sheet by sheet, row by row; before a reference
 * is read, every formula above and to the left of its far corner (the ones
 * that could spill into it) is computed first, so results never depend on
 * the order formulas were typed in.
 *
 * With a `cache` (kept by the caller from one recalculation to the next), a
 * formula that read only written values is not computed again while the
 * sheets it read (and, for LOOM.AHEAD, LOOM.BAND and LOOM.MODEL, the saved
 * models) have not changed: the source's version numbers say when they did.
 *
 * @example await calculate(source) // then .value('Outlook', 11, 1)
 */
export interface FormulaCell {
  sheet: string;
  row: number;
  column: number;
  formula: string;
}

/** What the evaluator reads: the cells as written (values and formula texts). */
export interface CellSource {
  /** the sheet's own name for a name in any case, or undefined when there is none */
  sheetName(name: string): string | undefined;
  /** the written content of a cell; undefined when empty */
  raw(sheet: string, row: number, column: number): CellValue | undefined;
  /** every formula cell, any order */
  formulas(): FormulaCell[];
  /** a number that changes whenever the sheet's cells change (for the cache) */
  version?(sheet: string): number;
  /** a number that changes whenever a model is saved, replaced or deleted (for the cache) */
  modelsVersion?(): number;
}

/** Results kept from one recalculation to the next (see calculate). */
export type ResultCache = Map<string, CachedResult>;

export interface CachedResult {
  reads: [string, number][];
  models?: number;
  grid?: CellValue[][];
  failure?: CellError;
}

/** What one formula's evaluation read. */
interface Trace {
  /** sheet → its version when first read */
  sheets: Map<string, number>;
  /** the models' version when a function that reads them was called */
  models?: number;
  /** false once it read a formula or spilled cell, or missed a sheet: then it is not cached */
  pure: boolean;
  /** error values read from single cells (the library hands some on without their message) */
  errors: InstanceType<typeof FormulaError>[];
}

export interface CellError {
  /** the host's error value, e.g. #VALUE! */
  code: string;
  message: string;
}

export interface FormulaResult {
  /** the value the cell shows (the error code for an error) */
  value: CellValue;
  error?: CellError;
  /** rows × columns of the whole result when it spills */
  spill?: { rows: number; columns: number };
}

export interface Calculation {
  /** the result of the formula in that cell, if it holds one */
  result(sheet: string, row: number, column: number): FormulaResult | undefined;
  /** the value spilled into an empty cell, if any */
  spilled(sheet: string, row: number, column: number): CellValue | undefined;
  /** true when the sheet has formula cells or spilled cells */
  touches(sheet: string): boolean;
  /** every formula result, for listing */
  results(): { cell: FormulaCell; result: FormulaResult }[];
}

/** An error a formula shows instead of a value. */
export class Failure extends Error {
  constructor(readonly code: string, message: string) {
    super(message);
  }
}

const key = (sheet: string, row: number, column: number) => `${sheet.toLowerCase()}|${row},${column}`;

export async function calculate(source: CellSource, functions: Record<string, LoomFunction> = LOOM_FUNCTIONS, cache?: ResultCache): Promise<Calculation> {
  const cells = source.formulas().slice().sort((a, b) => a.sheet.localeCompare(b.sheet) || a.row - b.row || a.column - b.column);
  const bySheet = new Map<string, FormulaCell[]>();
  for (const c of cells) {
    const k = c.sheet.toLowerCase();
    bySheet.set(k, [...(bySheet.get(k) ?? []), c]);
  }
  const results = new Map<string, FormulaResult>();
  const pending = new Map<string, Promise<FormulaResult>>();
  const spills = new Map<string, CellValue>();
  const spillSheets = new Set<string>();
  const engine = new FormulaEngine(functions, asFailure, toGrid);

  const compute = (cell: FormulaCell, stack: Set<string>): Promise<FormulaResult> => {
    const k = key(cell.sheet, cell.row, cell.column);
    let p = pending.get(k);
    if (!p) {
      const inner = new Set(stack).add(k);
      p = evaluateCell(cell, inner).then((r) => { results.set(k, r); return r; });
      pending.set(k, p);
    }
    return p;
  };

  const note = (trace: Trace, sheet: string) => {
    const k = sheet.toLowerCase();
    if (!trace.sheets.has(k)) trace.sheets.set(k, source.version?.(sheet) ?? NaN);
  };

  const cached = (k: string): CachedResult | undefined => {
    const hit = cache?.get(k);
    if (!hit || !source.version) return undefined;
    if (!hit.reads.every(([sheet, v]) => source.version!(sheet) === v)) return undefined;
    if (hit.models !== undefined && hit.models !== source.modelsVersion?.()) return undefined;
    return hit;
  };

  const readsModels = (formula: string) => Object.entries(functions).some(([name, fn]) => fn.readsModels && new RegExp(`\\bLOOM\\.${name}\\s*\\(`, 'i').test(formula));

  const evaluateCell = async (cell: FormulaCell, stack: Set<string>): Promise<FormulaResult> => {
    const cacheKey = `${cell.sheet.toLowerCase()}|${cell.formula}`;
    const hit = cached(cacheKey);
    let grid: CellValue[][];
    if (hit?.failure) return { value: hit.failure.code, error: hit.failure };
    if (hit?.grid) {
      grid = hit.grid;
    } else {
      // versions are taken before anything is read, so a change during the evaluation makes the entry stale, never wrong
      const trace: Trace = { sheets: new Map(), pure: true, errors: [] };
      note(trace, cell.sheet);
      if (readsModels(cell.formula)) trace.models = source.modelsVersion?.() ?? NaN;
      const remember = (entry: Pick<CachedResult, 'grid' | 'failure'>) => {
        if (!cache || !source.version || !trace.pure) return;
        cache.set(cacheKey, { ...entry, reads: [...trace.sheets], models: trace.models });
      };
      try {
        // every formula that could fill a cell this one reads is computed first
        for (const ref of engine.references(cell.formula, cell)) await computeInto(ref, stack);
        grid = resultGrid(await engine.evaluate(cell.formula, cell, reader(cell, stack, trace)), trace.errors);
      } catch (err) {
        const f = asFailure(err);
        const error = { code: f.code, message: f.message };
        remember({ failure: error });
        return { value: f.code, error };
      }
      remember({ grid });
    }
    const rows = grid.length, columns = grid[0].length;
    if (rows === 1 && columns === 1) return { value: grid[0][0] };
    // the spill area must be empty and not taken by an earlier spill
    for (let i = 0; i < rows; i++) {
      for (let j = 0; j < columns; j++) {
        if (i === 0 && j === 0) continue;
        const r = cell.row + i, c = cell.column + j;
        if (source.raw(cell.sheet, r, c) !== undefined || spills.has(key(cell.sheet, r, c))) {
          const area = formatA1({ row: cell.row, column: cell.column, rows, columns });
          const message = `the result needs ${area} (${rows} × ${columns} cells), but ${formatA1({ row: r, column: c, rows: 1, columns: 1 })} is not empty; clear it`;
          return { value: '#SPILL!', error: { code: '#SPILL!', message } };
        }
      }
    }
    for (let i = 0; i < rows; i++) {
      for (let j = 0; j < columns; j++) if (i || j) spills.set(key(cell.sheet, cell.row + i, cell.column + j), grid[i][j]);
    }
    spillSheets.add(cell.sheet.toLowerCase());
    return { value: grid[0][0], spill: { rows, columns } };
  };

  /** Computes the formulas above and to the left of a reference's far corner (the ones that could spill into it). */
  const computeInto = async (ref: Reference, stack: Set<string>) => {
    const sheet = source.sheetName(ref.sheet);
    if (sheet === undefined) return;
    const bottom = ref.row + ref.rows - 1, right = ref.column + ref.columns - 1;
    for (const f of bySheet.get(sheet.toLowerCase()) ?? []) {
      if (f.row <= bottom && f.column <= right && !stack.has(key(f.sheet, f.row, f.column))) await compute(f, stack);
    }
  };

  // Ranges of written values only (no formula, spill or error in them), read once per recalculation
  // and sheet version and handed to every formula that reads the same range: a sheet of LOOM cells
  // repeats the same history ranges, thousands of cells each. The functions never change their arguments.
  const valueRanges = new Map<string, { version: number; grid: unknown[][] }>();
  let readFormulaOrSpill = false;

  /** The cells as one formula reads them: written values, formula results, spilled values; errors as error values. */
  const reader = (at: FormulaCell, stack: Set<string>, trace: Trace): CellReader => {
    const handlesErrors = HANDLES_ERRORS.test(at.formula);
    const sheetOf = (name: string) => {
      const sheet = source.sheetName(name || at.sheet);
      if (sheet === undefined) {
        trace.pure = false; // the sheet may come
        throw new FormulaError('#REF!', `the formula refers to a sheet "${name}" that this workbook does not have`);
      }
      note(trace, sheet);
      return sheet;
    };
    const value = (sheet: string, r: number, c: number): unknown => {
      const raw = source.raw(sheet, r, c);
      if (typeof raw === 'string' && raw.startsWith('=')) {
        trace.pure = false;
        readFormulaOrSpill = true;
        const k = key(sheet, r, c);
        const done = results.get(k);
        const where = formatA1({ sheet, row: r, column: c, rows: 1, columns: 1 });
        if (!done) {
          return new FormulaError('#REF!', stack.has(k)
            ? `circular reference: ${where} depends on this cell`
            : `${where} is computed after this cell; the preview follows only references written in the formula`);
        }
        if (done.error) return new FormulaError(done.error.code, `${where} shows ${done.error.code}: ${done.error.message}`);
        return done.value;
      }
      if (raw === undefined) {
        const spilled = spills.get(key(sheet, r, c));
        if (spilled !== undefined) { trace.pure = false; readFormulaOrSpill = true; }
        return spilled ?? null;
      }
      return raw;
    };
    return {
      cell: (name, r, c) => {
        let v: unknown;
        try { v = value(sheetOf(name), r, c); } catch (err) { v = err; }
        if (!(v instanceof FormulaError)) return v;
        if (!handlesErrors) throw v;
        trace.errors.push(v);
        return v;
      },
      range: (ref) => {
        const sheet = sheetOf(ref.sheet);
        if (ref.rows * ref.columns > MAX_CELLS) throw new FormulaError('#VALUE!', `a reference of ${ref.rows * ref.columns} cells is more than the preview reads (${MAX_CELLS}); name the rows`);
        const memoKey = `${sheet.toLowerCase()}|${ref.row}|${ref.column}|${ref.rows}|${ref.columns}`;
        const version = source.version?.(sheet);
        const memo = valueRanges.get(memoKey);
        if (memo && version !== undefined && memo.version === version) return memo.grid;
        readFormulaOrSpill = false;
        const grid = Array.from({ length: ref.rows }, (_, i) => Array.from({ length: ref.columns }, (_, j) => value(sheet, ref.row + i, ref.column + j)));
        const error = grid.flat().find((v) => v instanceof FormulaError);
        if (error && !handlesErrors) throw error;
        if (!error && !readFormulaOrSpill && version !== undefined) valueRanges.set(memoKey, { version, grid });
        return grid;
      },
    };
  };

  for (const cell of cells) await compute(cell, new Set());
  if (cache) {
    const live = new Set(cells.map((c) => `${c.sheet.toLowerCase()}|${c.formula}`));
    for (const k of cache.keys()) if (!live.has(k)) cache.delete(k);
  }

  return {
    result: (sheet, row, column) => results.get(key(sheet, row, column)),
    spilled: (sheet, row, column) => spills.get(key(sheet, row, column)),
    touches: (sheet) => bySheet.has(sheet.toLowerCase()) || spillSheets.has(sheet.toLowerCase()),
    results: () => cells.map((cell) => ({ cell, result: results.get(key(cell.sheet, cell.row, cell.column))! })),
  };
}

/**
 * Error values read from cells: the formula library would let SUM, MAX and
 * the like skip an error cell and give a number, where the host shows the
 * error. So a cell or range showing an error fails the whole formula that
 * reads it, unless the formula itself handles errors (IFERROR, ISERROR, …):
 * then the error values reach those functions as the host gives them.
 */
const HANDLES_ERRORS = /\b(IFERROR|IFNA|ISERROR|ISERR|ISNA|ERROR\.TYPE)\s*\(/i;

/** most cells one reference may read (a whole column of a sheet is 1 048 576) */
const MAX_CELLS = 1_000_000;

/**
 * What a formula gave, as the cells it fills: a value is one cell, an
 * array its rows × columns; an error value fails the whole formula. A
 * formula that only refers to an empty cell shows 0, as the host shows it
 * (from memory); LOOM results keep their empty cells.
 */
function resultGrid(result: unknown, read: InstanceType<typeof FormulaError>[]): CellValue[][] {
  if (result instanceof FormulaError) {
    if (result.message) throw result;
    // the library gives a bare reference to an error cell as a plain #VALUE!: the cell's own error is the one to show
    throw read.find((e) => e.error === result.error) ?? (result.error === '#VALUE!' && read.length === 1 ? read[0] : result);
  }
  if (result === null || result === undefined) return [[0]];
  return toGrid(result, 'the formula');
}

/** A function's return value as rows × columns of cell values. */
function toGrid(result: unknown, name: string): CellValue[][] {
  const who = name === 'the formula' ? name : `LOOM.${name}`;
  const grid = Array.isArray(result) ? (result.every(Array.isArray) ? result as unknown[][] : result.map((v) => [v])) : [[result]];
  if (grid.length === 0 || grid[0].length === 0) throw new Failure('#VALUE!', `${who} gave an empty result`);
  const width = grid[0].length;
  return grid.map((row) => {
    if (row.length !== width) throw new Failure('#VALUE!', `${who} gave rows of different lengths`);
    return row.map((v) => cellOf(v, who));
  });
}

function cellOf(v: unknown, who: string): CellValue {
  if (v === null || v === undefined) return null;
  if (v instanceof FormulaError) throw v;
  if (typeof v === 'number') {
    if (Number.isNaN(v)) throw new Failure('#VALUE!', `${who} gave a value that is not a number`);
    if (!Number.isFinite(v)) throw new Failure('#NUM!', `${who} gave ${v}, which a cell cannot hold`);
    return v;
  }
  if (typeof v === 'string' || typeof v === 'boolean') return v;
  throw new Failure('#VALUE!', `${who} gave a value a cell cannot hold`);
}

/** Any thrown thing as a cell error: the host's error value and message when it carries them. */
function asFailure(err: unknown): Failure {
  if (err instanceof Failure) return err;
  if (err instanceof FormulaError) return new Failure(err.error, err.message || defaultMessage(err.error));
  const code = (err as { code?: unknown } | null)?.code;
  const message = err instanceof Error ? err.message : String(err);
  if (typeof code === 'string' && code.startsWith('#')) return new Failure(code, message);
  if (err instanceof InputError) return new Failure('#VALUE!', message);
  return new Failure('#N/A', `could not compute this (${message.split('\n')[0]})`);
}

/** What an error value means when the formula library gives no message of its own. */
function defaultMessage(code: string): string {
  const known: Record<string, string> = {
    '#DIV/0!': 'division by zero', '#VALUE!': 'a value of the wrong kind (text where a number belongs?)', '#NUM!': 'a number out of range',
    '#N/A': 'no value available', '#REF!': 'a reference that does not exist', '#NAME?': 'an unknown name', '#NULL!': 'ranges that do not meet',
  };
  return known[code] ?? code;
}
