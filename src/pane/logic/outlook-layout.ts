import { formatTimestamp, InputError } from '../../engine';
import type { CellValue, NumberFormat } from '../../host/workbook-port';
import { loomCall } from './formula-text';
import { DATETIME_FORMAT, PRICE_FORMAT, RATIO_FORMAT, SHARE_FORMAT, timeCell } from './number-formats';
import { cellNumber, type ForecastRow } from './place-layout';
import type { DataLayout } from './read-ranges';

/**
 * The outlook sheet a manager opens: a fixed frame, rebuilt as a whole on
 * every refresh so that nothing from an older, longer day is left behind.
 *
 *   row 1      title, model, issue time
 *   row 2      the caution line
 *   row 4      recent scores header; rows 5–10 one line per scored model
 *   row 12     header of tomorrow's table; rows 13… one per delivery period:
 *              start, =LOOM.AHEAD, =LOOM.BAND (lower, upper), =LOOM.BASELINE
 *              week and weekday-rule (each formula spills down)
 */
export const OUTLOOK_SHEET = 'Outlook';
export const OUTLOOK_COLUMNS = ['delivery start', 'forecast', 'lower', 'upper', 'naive-week', 'weekday-rule', ''];
const WIDTH = OUTLOOK_COLUMNS.length;
const SCORE_ROW = 3; // 0-based
const SCORE_SLOTS = 6;
const TABLE_ROW = 11; // 0-based header row of tomorrow's table
/** most periods in a delivery day: 96 quarter hours plus the repeated autumn hour */
export const MAX_PERIODS = 100;
export const OUTLOOK_FRAME = `${OUTLOOK_SHEET}!A1:G${TABLE_ROW + 1 + MAX_PERIODS}`;
export const CAUTION = "Forecasts are estimates with stated error, not trading advice. Check them against your desk's risk rules and the market's own rules.";

export interface ScoreLine {
  name: string;
  mae: number;
  rmse: number;
  smape: number;
  rmae: number;
  coverage?: number;
  /** what was scored, e.g. "backtest 2026-11-03 to 2026-11-30" */
  span: string;
}

export interface OutlookInput {
  model: string;
  coverage: number;
  issuedAt: number;
  zone: string;
  /** the workbook's date system, for the date-time cells */
  dateSystem: '1900' | '1904';
  /** tomorrow's periods (their start times fill the first column) */
  rows: ForecastRow[];
  data: DataLayout;
  scores: ScoreLine[];
}

export interface OutlookLayout {
  frame: string;
  values: CellValue[][];
  /** number formats of the frame's cells */
  formats: NumberFormat[][];
  /** the table the native chart draws: header row plus one row per period */
  chart: { sheet: string; address: string; title: string };
}

/**
 * @throws InputError when there is no period, more than MAX_PERIODS, or the
 *   drivers sit in more than one range
 */
export function outlookLayout(input: OutlookInput): OutlookLayout {
  const { rows, data, model, coverage, zone } = input;
  if (rows.length === 0) throw new InputError('there is no forecast for tomorrow yet; check the data and pick a model first');
  if (rows.length > MAX_PERIODS) throw new InputError(`tomorrow has ${rows.length} periods; the outlook holds at most ${MAX_PERIODS}`);
  if (data.drivers.length > 1) throw new InputError('the outlook formulas need all driver columns side by side in one range');
  const values: CellValue[][] = Array.from({ length: TABLE_ROW + 1 + MAX_PERIODS }, () => new Array<CellValue>(WIDTH).fill(''));
  const formats: NumberFormat[][] = values.map((row) => row.map(() => null));
  const put = (r: number, cells: CellValue[]) => cells.forEach((v, c) => (values[r][c] = v));
  const time = (t: number) => timeCell(t, zone, input.dateSystem);

  // the issue time as text with its offset, exact to the second (the archive keeps it the same way)
  put(0, ['Spotloom outlook', `model ${model}`, '', 'issued', formatTimestamp(input.issuedAt, zone), `times in ${zone}`]);
  put(1, [CAUTION]);
  put(SCORE_ROW, ['recent scores', 'MAE', 'RMSE', 'sMAPE %', 'rMAE', 'coverage', 'scored on']);
  if (input.scores.length === 0) put(SCORE_ROW + 1, ['none yet: run a backtest in Check']);
  input.scores.slice(0, SCORE_SLOTS).forEach((s, k) => put(SCORE_ROW + 1 + k, [
    s.name, cellNumber(s.mae), cellNumber(s.rmse), cellNumber(s.smape), cellNumber(s.rmae), s.coverage === undefined ? '' : cellNumber(s.coverage), s.span,
  ]));
  for (let k = 0; k < SCORE_SLOTS; k++) [null, PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT, RATIO_FORMAT, SHARE_FORMAT, null].forEach((f, c) => (formats[SCORE_ROW + 1 + k][c] = f));

  const drivers = data.drivers[0];
  const args = [{ ref: data.times }, { ref: data.prices }, drivers ? { ref: data.times } : undefined, drivers ? { ref: drivers } : undefined];
  put(TABLE_ROW, OUTLOOK_COLUMNS);
  rows.forEach((r, i) => put(TABLE_ROW + 1 + i, [time(r.time)]));
  // the whole table area carries its formats: the spilled cells show their own cell's format
  for (let i = 0; i < MAX_PERIODS; i++) [DATETIME_FORMAT, PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT, PRICE_FORMAT, null].forEach((f, c) => (formats[TABLE_ROW + 1 + i][c] = f));
  put(TABLE_ROW + 1, [
    time(rows[0].time),
    loomCall('AHEAD', [model, ...args]),
    loomCall('BAND', [model, ...args, coverage]),
    '',
    loomCall('BASELINE', [{ ref: data.times }, { ref: data.prices }, 'week']),
    loomCall('BASELINE', [{ ref: data.times }, { ref: data.prices }, 'weekday-rule']),
  ]);
  return {
    frame: OUTLOOK_FRAME,
    values,
    formats,
    chart: { sheet: OUTLOOK_SHEET, address: `${OUTLOOK_SHEET}!A${TABLE_ROW + 1}:F${TABLE_ROW + 1 + rows.length}`, title: 'Tomorrow: forecast, band and baselines' },
  };
}
