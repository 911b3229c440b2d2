import { InputError } from '../engine';
import { formatA1 } from '../host/a1';
import type { CellValue } from '../host/workbook-port';
import { parseFormula, type FormulaNode } from './formula-parse';
import { LOOM_FUNCTIONS, type LoomFunction } from './loom-functions';

/**
 * The preview grid's small evaluator: computes every formula cell of a
 * workbook once (a full recalculation), with spills as dynamic arrays have
 * them. A formula whose result has several cells writes the top-left one in
 * its own cell and spills the rest into the cells below and to the right,
 * which must be empty (else its cell shows #SPILL!). References read values:
 * a formula cell gives its result, a spilled cell its spilled value, an
 * empty cell null. A formula that refers to a cell showing an error shows
 * that error; one that refers to itself, directly or through others, #REF!.
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
  const parsed = new Map<string, FormulaNode | InputError>();

  const parse = (formula: string): FormulaNode => {
    let hit = parsed.get(formula);
    if (!hit) {
      try { hit = parseFormula(formula); } catch (err) { hit = err instanceof InputError ? err : new InputError(String(err)); }
      parsed.set(formula, hit);
    }
    if (hit instanceof InputError) throw new Failure('#NAME?', hit.message);
    return hit;
  };

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

  const evaluateCell = async (cell: FormulaCell, stack: Set<string>): Promise<FormulaResult> => {
    const cacheKey = `${cell.sheet.toLowerCase()}|${cell.formula}`;
    const hit = cached(cacheKey);
    let grid: CellValue[][];
    if (hit?.failure) return { value: hit.failure.code, error: hit.failure };
    if (hit?.grid) {
      grid = hit.grid;
    } else {
      // versions are taken before anything is read, so a change during the evaluation makes the entry stale, never wrong
      const trace: Trace = { sheets: new Map(), pure: true };
      note(trace, cell.sheet);
      const remember = (entry: Pick<CachedResult, 'grid' | 'failure'>) => {
        if (!cache || !source.version || !trace.pure) return;
        cache.set(cacheKey, { ...entry, reads: [...trace.sheets], models: trace.models });
      };
      try {
        grid = await evaluate(parse(cell.formula), cell, stack, trace);
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

  const evaluate = async (node: FormulaNode, at: FormulaCell, stack: Set<string>, trace: Trace): Promise<CellValue[][]> => {
    switch (node.kind) {
      case 'number': return [[node.value]];
      case 'text': return [[node.value]];
      case 'bool': return [[node.value]];
      case 'neg': {
        const inner = await evaluate(node.arg, at, stack, trace);
        return inner.map((row) => row.map((v) => {
          if (typeof v !== 'number') throw new Failure('#VALUE!', `cannot negate ${JSON.stringify(v)}: not a number`);
          return -v;
        }));
      }
      case 'ref': return read(node, at, stack, trace);
      case 'call': return call(node, at, stack, trace);
    }
  };

  const read = async (node: Extract<FormulaNode, { kind: 'ref' }>, at: FormulaCell, stack: Set<string>, trace: Trace): Promise<CellValue[][]> => {
    const { range } = node;
    const sheet = range.sheet === undefined ? at.sheet : source.sheetName(range.sheet);
    if (sheet === undefined) {
      trace.pure = false; // the sheet may come
      throw new Failure('#REF!', `${node.text} refers to a sheet "${range.sheet}" that this workbook does not have`);
    }
    note(trace, sheet);
    const bottom = range.row + range.rows - 1, right = range.column + range.columns - 1;
    for (const f of bySheet.get(sheet.toLowerCase()) ?? []) {
      if (f.row <= bottom && f.column <= right && !stack.has(key(f.sheet, f.row, f.column))) await compute(f, stack);
    }
    const out: CellValue[][] = [];
    for (let i = 0; i < range.rows; i++) {
      const row: CellValue[] = [];
      for (let j = 0; j < range.columns; j++) {
        const r = range.row + i, c = range.column + j, k = key(sheet, r, c);
        const raw = source.raw(sheet, r, c);
        if (typeof raw === 'string' && raw.startsWith('=')) {
          trace.pure = false;
          const done = results.get(k);
          const where = formatA1({ sheet, row: r, column: c, rows: 1, columns: 1 });
          if (!done) throw new Failure('#REF!', `circular reference: ${where} depends on this cell`);
          if (done.error) throw new Failure(done.error.code, `${where} shows ${done.error.code}: ${done.error.message}`);
          row.push(done.value);
        } else if (raw === undefined) {
          const spilled = spills.get(k);
          if (spilled !== undefined) trace.pure = false;
          row.push(spilled ?? null);
        } else {
          row.push(raw);
        }
      }
      out.push(row);
    }
    return out;
  };

  const call = async (node: Extract<FormulaNode, { kind: 'call' }>, at: FormulaCell, stack: Set<string>, trace: Trace): Promise<CellValue[][]> => {
    const fn = Object.prototype.hasOwnProperty.call(functions, node.name) ? functions[node.name] : undefined;
    if (!fn) throw new Failure('#NAME?', `LOOM.${node.name} is not a LOOM function; the preview knows ${Object.keys(functions).map((n) => `LOOM.${n}`).join(', ')}`);
    if (node.args.length > fn.params.length) throw new Failure('#VALUE!', `LOOM.${node.name} takes at most ${fn.params.length} arguments, got ${node.args.length}`);
    if (fn.readsModels && trace.models === undefined) trace.models = source.modelsVersion?.() ?? NaN;
    const args: unknown[] = [];
    for (let i = 0; i < fn.params.length; i++) {
      const arg = node.args[i];
      if (!arg) {
        if (i < fn.required) throw new Failure('#VALUE!', `LOOM.${node.name} needs at least ${fn.required} arguments; argument ${i + 1} is missing`);
        args.push(null);
        continue;
      }
      const grid = await evaluate(arg, at, stack, trace);
      if (fn.params[i] === 'matrix') { args.push(grid); continue; }
      if (grid.length !== 1 || grid[0].length !== 1) throw new Failure('#VALUE!', `argument ${i + 1} of LOOM.${node.name} must be one cell or value, not ${grid.length} × ${grid[0].length} cells`);
      args.push(grid[0][0]);
    }
    while (args.length && args[args.length - 1] === null) args.pop();
    let result: unknown;
    try {
      result = await fn.call(...(args as never[]));
    } catch (err) {
      throw asFailure(err);
    }
    return toGrid(result, node.name);
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

/** A function's return value as rows × columns of cell values. */
function toGrid(result: unknown, name: string): CellValue[][] {
  const grid = Array.isArray(result) ? (result.every(Array.isArray) ? result as unknown[][] : result.map((v) => [v])) : [[result]];
  if (grid.length === 0 || grid[0].length === 0) throw new Failure('#VALUE!', `LOOM.${name} gave an empty result`);
  const width = grid[0].length;
  return grid.map((row) => {
    if (row.length !== width) throw new Failure('#VALUE!', `LOOM.${name} gave rows of different lengths`);
    return row.map((v) => cellOf(v, name));
  });
}

function cellOf(v: unknown, name: string): CellValue {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) throw new Failure('#NUM!', `LOOM.${name} gave ${v}, which a cell cannot hold`);
    return v;
  }
  if (typeof v === 'string' || typeof v === 'boolean') return v;
  throw new Failure('#VALUE!', `LOOM.${name} gave a value a cell cannot hold`);
}

/** Any thrown thing as a cell error: the host's error value and message when it carries them. */
function asFailure(err: unknown): Failure {
  if (err instanceof Failure) return err;
  const code = (err as { code?: unknown } | null)?.code;
  const message = err instanceof Error ? err.message : String(err);
  if (typeof code === 'string' && code.startsWith('#')) return new Failure(code, message);
  if (err instanceof InputError) return new Failure('#VALUE!', message);
  return new Failure('#N/A', `could not compute this (${message.split('\n')[0]})`);
}
