import * as formulajs from '@formulajs/formulajs';
import FormulaParser, { type CellRef, type FunctionArg, type RangeRef } from 'fast-formula-parser';
import type { CellValue } from '../host/workbook-port';
import type { LoomFunction } from './loom-functions';

/**
 * The preview's formula language, from libraries rather than our own
 * parser: fast-formula-parser (MIT) reads a formula and evaluates its
 * operators (+ - * / ^ & % and comparisons), references (`A1`, `B2:D9`,
 * `'Forecast archive'!F2:F9`) and its own functions (SUM, AVERAGE, ROUND,
 * IF, ABS, IFERROR, COUNT, … about 280); @formulajs/formulajs (MIT) adds the
 * common ones it lacks (MAX, MIN, MEDIAN, STDEV.S, …, see EXTRA). The LOOM
 * functions are the add-in's own cell functions, called through the
 * parser's custom-function hook; a result of several cells comes back as
 * rows × columns for the caller to spill.
 *
 * Neither library generates code from strings at run time, so the preview
 * keeps its Content-Security-Policy without 'unsafe-eval' (checked by the
 * end-to-end run).
 *
 * Cells are read through a `reader` set for each evaluation (one at a time:
 * the parser keeps the formula's position while it runs).
 *
 * @example await engine.evaluate('=ROUND(SUM(A1:A3) / 3, 2)', { sheet: 'S', row: 0, column: 4 }, reader)
 */
const { FormulaError, DepParser } = FormulaParser;
export { FormulaError };

/** A 0-based cell position with its sheet. */
export interface Position {
  sheet: string;
  row: number;
  column: number;
}

/** A reference a formula makes, 0-based and inclusive, in the sheet's spelling given. */
export interface Reference {
  sheet: string;
  row: number;
  column: number;
  rows: number;
  columns: number;
}

/** How the engine reads cells while it evaluates; an error cell gives a FormulaError. */
export interface CellReader {
  cell(sheet: string, row: number, column: number): unknown;
  range(ref: Reference): unknown[][];
}

/** Excel name → @formulajs/formulajs implementation, for common functions the parser does not have. */
const EXTRA: Record<string, (...args: unknown[]) => unknown> = {
  MAX: formulajs.MAX, MIN: formulajs.MIN, MAXA: formulajs.MAXA, MINA: formulajs.MINA, MEDIAN: formulajs.MEDIAN,
  LARGE: formulajs.LARGE, SMALL: formulajs.SMALL, COUNTA: formulajs.COUNTA, COUNTBLANK: formulajs.COUNTBLANK,
  STDEV: formulajs.STDEV.S, 'STDEV.S': formulajs.STDEV.S, 'STDEV.P': formulajs.STDEV.P,
  VAR: formulajs.VAR.S, 'VAR.S': formulajs.VAR.S, 'VAR.P': formulajs.VAR.P,
  'PERCENTILE.INC': formulajs.PERCENTILE.INC, 'PERCENTILE.EXC': formulajs.PERCENTILE.EXC, 'QUARTILE.INC': formulajs.QUARTILE.INC,
  SUMIFS: formulajs.SUMIFS, COUNTIFS: formulajs.COUNTIFS, AVERAGEIFS: formulajs.AVERAGEIFS, MAXIFS: formulajs.MAXIFS, MINIFS: formulajs.MINIFS,
  LEN: formulajs.LEN, UPPER: formulajs.UPPER, SUBSTITUTE: formulajs.SUBSTITUTE, TEXTJOIN: formulajs.TEXTJOIN, MATCH: formulajs.MATCH,
} as never;

/** A formulajs function behind the parser's argument shape; its Error results become the parser's error values. */
function fromFormulajs(fn: (...args: unknown[]) => unknown) {
  return (...args: FunctionArg[]) => {
    const result = fn(...args.map((a) => (a.omitted ? undefined : a.value)));
    if (result instanceof FormulaError) return result;
    if (result instanceof Error) return new FormulaError(result.message.startsWith('#') ? result.message : '#VALUE!');
    return result;
  };
}

/** A thrown or returned error as the parser's error value, with the host's code and our message. */
export type ToFailure = (err: unknown) => { code: string; message: string };

export class FormulaEngine {
  private readonly parser: FormulaParser;
  private readonly deps = new DepParser();
  private reader?: CellReader;
  private readonly loomNames: string[];

  /**
   * @param loom the LOOM functions by name (AHEAD, BAND, …)
   * @param toFailure how a LOOM function's exception becomes a cell error
   * @param toGrid how a LOOM function's result becomes rows × columns (it throws a cell error for a bad one)
   */
  constructor(loom: Record<string, LoomFunction>, toFailure: ToFailure, toGrid: (result: unknown, name: string) => CellValue[][]) {
    this.loomNames = Object.keys(loom).map((n) => `LOOM.${n}`);
    const functions: Record<string, (...args: FunctionArg[]) => unknown> = {};
    for (const [name, fn] of Object.entries(EXTRA)) functions[name] = fromFormulajs(fn);
    // nothing in the preview goes to the network
    functions.WEBSERVICE = () => new FormulaError('#N/A', 'the preview makes no network requests');
    for (const [name, fn] of Object.entries(loom)) {
      functions[`LOOM.${name}`] = (...args) => callLoom(name, fn, args, toFailure, toGrid);
    }
    this.parser = new FormulaParser({
      functions,
      onCell: (ref) => this.reader!.cell(ref.sheet ?? '', ref.row - 1, ref.col - 1),
      onRange: (ref) => this.reader!.range(toReference(ref)),
    });
  }

  /** The references written in a formula (without the `=`-less check: give the formula as the cell holds it). */
  references(formula: string, at: Position): Reference[] {
    try {
      return this.deps.parse(formula.slice(1), { sheet: at.sheet, row: at.row + 1, col: at.column + 1 }).map(toReference);
    } catch {
      return []; // a formula that does not parse fails in evaluate, with the parser's message
    }
  }

  /**
   * Evaluates a formula (as the cell holds it, with its `=`): a value, a
   * FormulaError, or rows × columns of values (a range or an array result).
   *
   * @throws FormulaError when the formula cannot be read or names a function nobody knows
   */
  async evaluate(formula: string, at: Position, reader: CellReader): Promise<unknown> {
    const text = formula.slice(1).trim();
    if (text === '') throw new FormulaError('#NAME?', 'the formula is empty');
    this.reader = reader;
    try {
      const result = await this.parser.parseAsync(text, { sheet: at.sheet, row: at.row + 1, col: at.column + 1 }, true);
      return result instanceof FormulaError && /is not implemented/.test(result.message) ? readable(result, this.loomNames) : result;
    } catch (err) {
      // an exception from a cell read comes back wrapped in the library's #ERROR!
      const inner = (err as { details?: unknown }).details;
      throw inner instanceof FormulaError && !/is not implemented/.test(inner.message) ? inner : readable(err, this.loomNames);
    } finally {
      this.reader = undefined;
    }
  }
}

function toReference(ref: CellRef | RangeRef): Reference {
  if ('from' in ref) {
    return { sheet: ref.sheet ?? '', row: ref.from.row - 1, column: ref.from.col - 1, rows: ref.to.row - ref.from.row + 1, columns: ref.to.col - ref.from.col + 1 };
  }
  return { sheet: ref.sheet ?? '', row: ref.row - 1, column: ref.col - 1, rows: 1, columns: 1 };
}

/** The parser's own failures (a formula it cannot read, a function it does not know) as one readable line. */
function readable(err: unknown, loomNames: string[]): InstanceType<typeof FormulaError> {
  const message = err instanceof Error ? err.message : String(err);
  const unknown = /Function (\S+) is not implemented/.exec(message);
  if (unknown) {
    const name = unknown[1];
    return new FormulaError('#NAME?', /^LOOM\./i.test(name) ? `${name} is not a LOOM function; the preview knows ${loomNames.join(', ')}` : `${name} is not a function the preview knows`);
  }
  if (err instanceof FormulaError && err.error !== '#ERROR!') return err;
  const where = /Error at position (\d+):(\d+)/.exec(message);
  return new FormulaError('#NAME?', `cannot read the formula${where ? ` (at character ${where[2]})` : ''}: ${message.split('\n').find((l) => l.trim()) ?? 'syntax error'}`.slice(0, 300));
}

/**
 * One LOOM call: arguments shaped as the function's metadata says (a
 * `matrix` gets rows × columns, a `scalar` one value, an omitted optional
 * one null), the result as rows × columns (one value when it is a single
 * cell, so it can take part in arithmetic). An error never escapes as an
 * exception: it is returned as the error value, so IFERROR can catch it.
 */
/**
 * A range's values as a cell function gets them (empty as null), or the
 * first error value in it. The evaluator hands every formula that reads the
 * same range of written values one grid (formula-eval.ts), so the result is
 * kept per grid and the functions see the same arrays again (range-cache.ts
 * then finds its entry by their identity).
 */
const converted = new WeakMap<unknown[][], CellValue[][] | InstanceType<typeof FormulaError>>();

function asCells(grid: unknown[][]): CellValue[][] | InstanceType<typeof FormulaError> {
  const hit = converted.get(grid);
  if (hit) return hit;
  const error = grid.flat().find((v) => v instanceof FormulaError) as InstanceType<typeof FormulaError> | undefined;
  const out = error ?? grid.map((row) => row.map((v) => (v === undefined ? null : v) as CellValue));
  converted.set(grid, out);
  return out;
}

async function callLoom(name: string, fn: LoomFunction, args: FunctionArg[], toFailure: ToFailure, toGrid: (r: unknown, n: string) => CellValue[][]): Promise<unknown> {
  const fail = (code: string, message: string) => new FormulaError(code, message);
  if (args.length > fn.params.length) return fail('#VALUE!', `LOOM.${name} takes at most ${fn.params.length} argument${fn.params.length === 1 ? '' : 's'}, got ${args.length}`);
  const values: unknown[] = [];
  for (let i = 0; i < fn.params.length; i++) {
    const arg = args[i];
    if (!arg || arg.omitted) {
      if (i < fn.required) return fail('#VALUE!', `LOOM.${name} needs at least ${fn.required} argument${fn.required === 1 ? '' : 's'}; argument ${i + 1} is missing`);
      values.push(null);
      continue;
    }
    const grid = Array.isArray(arg.value) ? (arg.value as unknown[][]) : [[arg.value]];
    const converted = asCells(grid);
    if (converted instanceof FormulaError) return converted;
    const cells = converted;
    if (fn.params[i] === 'matrix') { values.push(cells); continue; }
    if (cells.length !== 1 || cells[0].length !== 1) return fail('#VALUE!', `argument ${i + 1} of LOOM.${name} must be one cell or value, not ${cells.length} × ${cells[0].length} cells`);
    values.push(cells[0][0]);
  }
  while (values.length && values[values.length - 1] === null) values.pop();
  try {
    const grid = toGrid(await fn.call(...(values as never[])), name);
    return grid.length === 1 && grid[0].length === 1 ? grid[0][0] : grid;
  } catch (err) {
    const f = toFailure(err);
    return fail(f.code, f.message);
  }
}
