import { DEMO_MARKET, generateMarket, InputError, type DemoRow } from '../engine';
import type { CellValue } from '../host/workbook-port';

/**
 * The preview's demo workbook: the invented scenario of DEMO_MARKET (the
 * market zone Brindlemoor, traded by Quillfeather Energy Trading, both made
 * up), seed 1 as `spotloom demo` uses it, cut to its last days so the
 * preview stays quick.
 *
 * Sheets, in order:
 * - History: `timestamp, price, temperature_forecast, load_forecast`, one row
 *   per hour of the last `days` delivery days, then the next day's rows with
 *   the driver forecasts and an empty price (the day to forecast);
 * - Drivers: that next day's driver forecasts alone, as a vendor sends them;
 * - Outlook: a note where the pane's "Refresh outlook" rebuilds columns A–G,
 *   and beside it (columns H–N) every LOOM function at work on History;
 * - Forecast: an empty sheet with a note, for the pane's Place section.
 *
 * @param options.days delivery days with prices (default 400, at least MIN_DAYS)
 * @param options.rows the market's rows (default generateMarket(DEMO_MARKET, 1))
 * @throws InputError for fewer than MIN_DAYS days
 * @example demoWorkbook().ranges.times // 'History!A1:A9626'
 */
export interface DemoWorkbook {
  sheets: Record<string, CellValue[][]>;
  /** what the Data section starts with */
  ranges: { times: string; prices: string; drivers: string[] };
  zone: string;
  region: string;
  /** the delivery day to forecast (its prices are empty) */
  tomorrow: string;
  /** sheet rows (1-based) of History: the first data row, the last row with a price, the last row */
  rows: { first: number; lastPrice: number; last: number };
  /** the scored window of the showcase: the last SCORE_DAYS days with prices, as History addresses */
  scored: { days: number; times: string; actual: string; naiveDay: string; naiveWeek: string };
  /** where the showcase formulas sit on the Outlook sheet */
  showcase: Record<ShowcaseCell, string>;
}

export type ShowcaseCell = 'holidayTomorrow' | 'holidayKnown' | 'lastPrice' | 'scoreDay' | 'scoreWeek' | 'compare' | 'modelMae' | 'ahead' | 'band' | 'baselineWeek' | 'baselineDay' | 'baselineRule' | 'modelTable';

export const DEMO_DAYS = 400;
export const SCORE_DAYS = 28;
export const DEMO_SEED = 1;
export const MODEL_NAME = 'main';
/** the scored window, the week before it, and a day */
export const MIN_DAYS = SCORE_DAYS + 8;
const DRIVERS = ['temperature_forecast', 'load_forecast'] as const;

export function demoWorkbook(options: { days?: number; rows?: DemoRow[] } = {}): DemoWorkbook {
  const days = options.days ?? DEMO_DAYS;
  if (!Number.isInteger(days) || days < MIN_DAYS) throw new InputError(`the demo workbook needs at least ${MIN_DAYS} days (the scored window and its week before), got ${days}`);
  const all = options.rows ?? generateMarket(DEMO_MARKET, DEMO_SEED);
  const dates = [...new Set(all.map((r) => r.timestamp.slice(0, 10)))];
  const tomorrow = dates[dates.length - 1];
  const keep = new Set(dates.slice(-(days + 1)));
  const rows = all.filter((r) => keep.has(r.timestamp.slice(0, 10)));

  const history: CellValue[][] = [['timestamp', 'price', ...DRIVERS]];
  for (const r of rows) {
    const open = r.timestamp.startsWith(tomorrow);
    history.push([r.timestamp, open ? null : r.price, r.temperature_forecast, r.load_forecast]);
  }
  const first = 2, last = history.length;
  const lastPrice = last - rows.filter((r) => r.timestamp.startsWith(tomorrow)).length;
  const abs = (col: string, from: number, to: number) => `History!$${col}$${from}:$${col}$${to}`;
  const times = abs('A', first, last), prices = abs('B', first, last), drivers = `History!$C$${first}:$D$${last}`;

  // the scored window: the last SCORE_DAYS days with prices, against the same hours one day and one week before
  const scoredDays = new Set(dates.slice(-(SCORE_DAYS + 1), -1));
  const from = history.findIndex((row) => typeof row[0] === 'string' && scoredDays.has(row[0].slice(0, 10))) + 1;
  checkLag(history, from, lastPrice, 24, 1);
  checkLag(history, from, lastPrice, 168, 7);
  const scored = {
    days: SCORE_DAYS,
    times: abs('A', from, lastPrice),
    actual: abs('B', from, lastPrice),
    naiveDay: abs('B', from - 24, lastPrice - 24),
    naiveWeek: abs('B', from - 168, lastPrice - 168),
  };

  const drive: CellValue[][] = [['timestamp', ...DRIVERS, '', 'note']];
  rows.filter((r) => r.timestamp.startsWith(tomorrow)).forEach((r, i) => {
    drive.push([r.timestamp, r.temperature_forecast, r.load_forecast, '', i === 0 ? `Driver forecasts for ${tomorrow} as the (invented) weather and load vendor sent them; History holds them too, in its last rows with an empty price.` : '']);
  });

  const m = `"${MODEL_NAME}"`;
  const data = `${times}, ${prices}, ${times}, ${drivers}`;
  const formulas: Record<ShowcaseCell, [string, string, string]> = {
    holidayTomorrow: ['J4', 'holiday on the next day (DE)', '=LOOM.HOLIDAY(J3, "DE")'],
    holidayKnown: ['J5', 'holiday on 2026-10-03 (DE)', '=LOOM.HOLIDAY("2026-10-03", "DE")'],
    lastPrice: ['J6', 'last known price', `=History!B${lastPrice}`],
    scoreDay: ['J7', `naive-day MAE, last ${SCORE_DAYS} days`, `=LOOM.SCORE(${scored.actual}, ${scored.naiveDay}, "MAE")`],
    scoreWeek: ['J8', `naive-week MAE, last ${SCORE_DAYS} days`, `=LOOM.SCORE(${scored.actual}, ${scored.naiveWeek}, "MAE")`],
    compare: ['J9', 'naive-day better than naive-week? (DM p-value)', `=LOOM.COMPARE(${scored.actual}, ${scored.naiveDay}, ${scored.naiveWeek}, "abs", ${scored.times})`],
    modelMae: ['J10', `validation MAE of model ${m}`, `=LOOM.MODEL(${m}, "validation_mae")`],
    ahead: ['I13', '', `=LOOM.AHEAD(${m}, ${data})`],
    band: ['J13', '', `=LOOM.BAND(${m}, ${data}, 0.9)`],
    baselineWeek: ['L13', '', `=LOOM.BASELINE(${times}, ${prices}, "week")`],
    baselineDay: ['M13', '', `=LOOM.BASELINE(${times}, ${prices}, "day")`],
    baselineRule: ['N13', '', `=LOOM.BASELINE(${times}, ${prices}, "weekday-rule")`],
    modelTable: ['I40', '', `=LOOM.MODEL(${m})`],
  };
  const outlook: CellValue[][] = Array.from({ length: 40 }, () => new Array<CellValue>(14).fill(null));
  const put = (cell: string, v: CellValue) => {
    const col = cell.charCodeAt(0) - 65, row = Number(cell.slice(1)) - 1;
    outlook[row][col] = v;
  };
  put('A1', 'Brindlemoor day-ahead outlook');
  put('A2', 'Invented scenario: the market zone Brindlemoor and Quillfeather Energy Trading are made up.');
  put('A3', `Train a model named ${m} in the Spotloom pane, then press "Refresh outlook" in Place: it rebuilds columns A to G of this sheet (you are asked first).`);
  put('I1', 'LOOM functions on this workbook');
  put('I3', 'next delivery day');
  put('J3', tomorrow);
  for (const [cell, label, formula] of Object.values(formulas)) {
    if (label) put(`I${cell.slice(1)}`, label);
    put(cell, formula);
  }
  put('H12', 'delivery start');
  ['LOOM.AHEAD', 'LOOM.BAND lower', 'upper', 'naive-week', 'naive-day', 'weekday-rule'].forEach((t, k) => put(`${String.fromCharCode(73 + k)}12`, t));
  rows.filter((r) => r.timestamp.startsWith(tomorrow)).slice(0, 25).forEach((r, i) => put(`H${13 + i}`, r.timestamp));
  put('I39', `facts of model ${m} (LOOM.MODEL)`);

  const forecast: CellValue[][] = [['Place a forecast block here: in the Place section, top-left cell Forecast!A1. You are asked before this note is overwritten.']];

  return {
    sheets: { History: history, Drivers: drive, Outlook: outlook, Forecast: forecast },
    ranges: { times: `History!A1:A${last}`, prices: `History!B1:B${last}`, drivers: [`History!C1:D${last}`] },
    zone: DEMO_MARKET.zone,
    region: DEMO_MARKET.region,
    tomorrow,
    rows: { first, lastPrice, last },
    scored,
    showcase: Object.fromEntries(Object.entries(formulas).map(([k, [cell]]) => [k, `Outlook!${cell}`])) as Record<ShowcaseCell, string>,
  };
}

/** The rows `lag` periods before each scored row must be the same hour `days` days before (no clock change in between). */
function checkLag(history: CellValue[][], from: number, to: number, lag: number, days: number): void {
  for (let row = from; row <= to; row++) {
    const now = String(history[row - 1][0]), then = String(history[row - 1 - lag][0]);
    const shifted = new Date(Date.parse(`${now.slice(0, 10)}T00:00:00Z`) - days * 86_400_000).toISOString().slice(0, 10);
    if (then.slice(0, 10) !== shifted || then.slice(11, 16) !== now.slice(11, 16)) {
      throw new Error(`demo workbook: row ${row - lag} (${then}) is not ${days} day(s) before row ${row} (${now}); move the scored window off the clock change`);
    }
  }
}
