import { InputError } from '../../engine';
import { formatA1, parseA1 } from '../../host/a1';
import type { CellValue, NumberFormat } from '../../host/workbook-port';
import { loomCall } from './formula-text';
import { columnFormats, DATETIME_FORMAT, PRICE_FORMAT, RATIO_FORMAT, timeCell } from './number-formats';
import type { DataLayout } from './read-ranges';

/** One forecast period as the pane holds it (forecastAhead's AheadRow). */
export interface ForecastRow {
  time: number;
  forecast: number;
  lower: number;
  upper: number;
}

/** One period of a backtest, the columns the score formulas read. */
export interface ScoredRow {
  time: number;
  actual: number;
  forecast: number;
  naiveWeek: number;
}

/** A rectangle to write: its address and its rows × columns. */
export interface Block {
  address: string;
  values: CellValue[][];
  /** number formats of the same cells */
  formats: NumberFormat[][];
}

export interface PlaceInput {
  /** top-left cell of the block, with sheet */
  anchor: string;
  zone: string;
  /** the workbook's date system, for the date-time cells */
  dateSystem: '1900' | '1904';
  /** tomorrow's forecast periods */
  rows: ForecastRow[];
  model: string;
  coverage: number;
  data: DataLayout;
  /** a backtest to lay beside the block, so score formulas have something to read */
  backtest?: ScoredRow[];
}

export const FORECAST_HEADER = ['delivery start', 'forecast', 'lower', 'upper'];
export const BACKTEST_HEADER = ['backtest period', 'actual', 'forecast', 'naive-week'];
/** columns between the forecast part and the backtest part of a formula block */
const GAP = 1;

/**
 * A number for a cell, unrounded so that a score computed from the sheet
 * equals the engine's; unknown (NaN) is an empty cell.
 */
export function cellNumber(x: number): CellValue {
  return Number.isFinite(x) ? x : '';
}

const FORECAST_FORMATS = [DATETIME_FORMAT, PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT];

/**
 * The values block: header `delivery start, forecast, lower, upper` and one
 * row per period, times as date-time cells in the market zone, prices with
 * two decimals.
 *
 * @example valuesBlock({ anchor: 'Sheet1!B2', ... }).address // 'Sheet1!B2:E26' for 24 periods
 */
export function valuesBlock(input: Pick<PlaceInput, 'anchor' | 'zone' | 'rows' | 'dateSystem'>): Block {
  if (input.rows.length === 0) throw new InputError('there is no forecast to write; check the data first');
  const values: CellValue[][] = [FORECAST_HEADER.slice()];
  for (const r of input.rows) values.push([timeCell(r.time, input.zone, input.dateSystem), cellNumber(r.forecast), cellNumber(r.lower), cellNumber(r.upper)]);
  return { address: blockAddress(input.anchor, values), values, formats: columnFormats(values, FORECAST_FORMATS, [0]) };
}

/**
 * The live formula block. Left part: the delivery starts of tomorrow as
 * values, `=LOOM.AHEAD(...)` spilling the forecasts and `=LOOM.BAND(...)`
 * spilling lower and upper beside it. With a backtest: the backtest periods
 * (actual, forecast, naive-week) to the right, after one empty column, and
 * below the left part `=LOOM.SCORE(...)` rows for MAE, RMSE, sMAPE and rMAE
 * that read those columns. Cells a formula spills into are written empty.
 *
 * @throws InputError when drivers are in more than one range (a formula takes one range)
 */
export function formulaBlock(input: PlaceInput): Block {
  const { rows, data, model, coverage, zone } = input;
  if (rows.length === 0) throw new InputError('there is no forecast to lay out; check the data first');
  if (data.drivers.length > 1) {
    throw new InputError('the formula block needs all driver columns side by side in one range; move them together or pick one range');
  }
  const anchor = parseA1(input.anchor);
  const drivers = data.drivers[0];
  const dataArgs = [{ ref: data.times }, { ref: data.prices }, drivers ? { ref: data.times } : undefined, drivers ? { ref: drivers } : undefined];
  const left: CellValue[][] = [FORECAST_HEADER.slice()];
  const time = (t: number) => timeCell(t, zone, input.dateSystem);
  rows.forEach((r, i) => left.push([
    time(r.time),
    i === 0 ? loomCall('AHEAD', [model, ...dataArgs]) : '',
    i === 0 ? loomCall('BAND', [model, ...dataArgs, coverage]) : '',
    '',
  ]));
  const bt = input.backtest ?? [];
  if (bt.length === 0) return { address: blockAddress(input.anchor, left), values: left, formats: columnFormats(left, FORECAST_FORMATS, [0]) };

  const btCol = anchor.column + FORECAST_HEADER.length + GAP;
  const col = (k: number) => formatA1({ sheet: anchor.sheet, row: anchor.row + 1, column: btCol + k, rows: bt.length, columns: 1 });
  const [actual, forecast, naive] = [col(1), col(2), col(3)];
  left.push(['', '', '', '']);
  left.push(['backtest MAE', loomCall('SCORE', [{ ref: actual }, { ref: forecast }, 'MAE']), '', '']);
  left.push(['backtest RMSE', loomCall('SCORE', [{ ref: actual }, { ref: forecast }, 'RMSE']), '', '']);
  left.push(['backtest sMAPE %', loomCall('SCORE', [{ ref: actual }, { ref: forecast }, 'SMAPE']), '', '']);
  left.push(['backtest rMAE (vs naive-week)', loomCall('SCORE', [{ ref: actual }, { ref: forecast }, 'RMAE', { ref: naive }]), '', '']);
  const right: CellValue[][] = [BACKTEST_HEADER.slice()];
  for (const r of bt) right.push([time(r.time), cellNumber(r.actual), cellNumber(r.forecast), cellNumber(r.naiveWeek)]);
  const height = Math.max(left.length, right.length);
  const width = FORECAST_HEADER.length + GAP + BACKTEST_HEADER.length;
  const values: CellValue[][] = [];
  const formats: NumberFormat[][] = [];
  const scoreRow = 1 + rows.length + 1; // first =LOOM.SCORE row: MAE, RMSE, sMAPE %, rMAE
  const scoreFormats = [PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT, RATIO_FORMAT];
  for (let i = 0; i < height; i++) {
    const row: CellValue[] = new Array(width).fill('');
    const format: NumberFormat[] = new Array(width).fill(null);
    (left[i] ?? []).forEach((v, c) => (row[c] = v));
    (right[i] ?? []).forEach((v, c) => (row[FORECAST_HEADER.length + GAP + c] = v));
    if (i > 0 && i <= rows.length) FORECAST_FORMATS.forEach((f, c) => (format[c] = f));
    if (i >= scoreRow && i < scoreRow + scoreFormats.length) format[1] = scoreFormats[i - scoreRow];
    if (i > 0 && i <= bt.length) FORECAST_FORMATS.forEach((f, c) => (format[FORECAST_HEADER.length + GAP + c] = f));
    values.push(row);
    formats.push(format);
  }
  return { address: blockAddress(input.anchor, values), values, formats };
}

/** The address of `values` written with its top-left cell at `anchor`. */
export function blockAddress(anchor: string, values: CellValue[][]): string {
  const a = parseA1(anchor);
  return formatA1({ sheet: a.sheet, row: a.row, column: a.column, rows: values.length, columns: values[0]?.length ?? 1 });
}
