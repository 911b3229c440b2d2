import { buildSeries, describeIngest, InputError, type IngestReport, type Series, type Table } from '../../engine';
import { columnName, formatA1, parseA1, type A1Range } from '../../host/a1';
import type { CellValue, WorkbookPort } from '../../host/workbook-port';
import { timeReader } from './cell-time';

/** The ranges the user picked in Data, as A1 addresses (with sheet). */
export interface RangeChoice {
  times: string;
  prices: string;
  /** zero or more ranges; each may hold several driver columns */
  drivers: string[];
}

export interface RangeValues {
  address: string;
  values: CellValue[][];
}

/**
 * Where the data sit once headers are taken off: the addresses the formula
 * block and the outlook sheet refer to.
 */
export interface DataLayout {
  times: string;
  prices: string;
  drivers: string[];
  driverNames: string[];
  /** data rows, trailing blank rows left out */
  rows: number;
}

export interface DataCheck {
  series: Series;
  report: IngestReport;
  lines: string[];
  layout: DataLayout;
  /** sheet row of the first data row whose price is unknown after the last known price */
  firstOpenRow?: number;
}

const NUMERIC = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const NAME_OK = /[^A-Za-z0-9_ .-]+/g;

/**
 * Splits a text box entry into addresses: commas or semicolons between
 * ranges, blanks ignored. A comma inside a quoted sheet name stays.
 *
 * @example splitAddresses("Drivers!B2:C90; 'My sheet'!D2:D90") // ['Drivers!B2:C90', "'My sheet'!D2:D90"]
 */
export function splitAddresses(text: string): string[] {
  const out: string[] = [];
  let current = '', quoted = false;
  for (const ch of text) {
    if (ch === "'") quoted = !quoted;
    if (!quoted && (ch === ',' || ch === ';')) { out.push(current); current = ''; continue; }
    current += ch;
  }
  out.push(current);
  return out.map((s) => s.trim()).filter(Boolean);
}

/**
 * A driver name the stored-model schema accepts (letters, digits, `_ . -`
 * and spaces, up to 64 characters, not starting with a space or dot);
 * anything else becomes `_`. An empty result falls back to `fallback`.
 *
 * @example driverName('Temperature (°C)', 'driver_C') // 'Temperature _C_'
 */
export function driverName(header: string, fallback: string): string {
  const clean = header.trim().replace(NAME_OK, '_').replace(/^[ .-]+/, '').slice(0, 64).trim();
  if (clean === '' || /^(timestamp|price)$/i.test(clean)) return clean === '' ? fallback : `${clean}_driver`;
  return clean;
}

/** True when the first cell of a value column is a column name rather than data. */
export function isHeaderCell(value: CellValue, kind: 'times' | 'values'): boolean {
  if (typeof value !== 'string') return false;
  const t = value.trim();
  if (t === '' || NUMERIC.test(t)) return false;
  // a timestamp written as text starts with its year
  return kind === 'values' || !/^\d{4}-\d{2}-\d{2}/.test(t);
}

/**
 * Turns the picked ranges (already read) into the engine's Table: header
 * `timestamp, price, <drivers…>`, one row per sheet row, timestamps as UTC
 * ISO text so that the engine's own parser reads them.
 *
 * Rules: the timestamp and price ranges are one column each; a first row
 * of text is a header (its driver names are kept); all ranges must have
 * the same number of data rows; trailing rows that are blank in every
 * range are left out; a row with values but no timestamp is refused.
 * Row numbers in messages are sheet rows of the timestamp range.
 *
 * @throws InputError with one line naming the range, row and column
 */
export function tableFromRanges(
  input: { times: RangeValues; prices: RangeValues; drivers: RangeValues[] },
  options: { zone: string; dateSystem: '1900' | '1904' },
): { table: Table; layout: DataLayout } {
  const timesRange = parseA1(input.times.address);
  const pricesRange = parseA1(input.prices.address);
  if (timesRange.columns !== 1) throw new InputError(`the timestamp range ${input.times.address} must be one column wide`);
  if (pricesRange.columns !== 1) throw new InputError(`the price range ${input.prices.address} must be one column wide`);
  const source = timesRange.sheet ?? 'the sheet';

  const times = column(input.times.values, 0);
  const prices = column(input.prices.values, 0);
  const timesHeader = isHeaderCell(times[0], 'times');
  const pricesHeader = isHeaderCell(prices[0], 'values');
  const driverColumns: { name: string; values: CellValue[]; header: boolean; range: A1Range; address: string }[] = [];
  for (const d of input.drivers) {
    const r = parseA1(d.address);
    // one decision per range: a header row when any of its first cells is a column name
    const header = Array.from({ length: r.columns }, (_, c) => column(d.values, c)[0]).some((v) => isHeaderCell(v, 'values'));
    for (let c = 0; c < r.columns; c++) {
      const values = column(d.values, c);
      const fallback = `driver_${columnName(r.column + c)}`;
      const name = header && typeof values[0] === 'string' && values[0].trim() ? driverName(values[0], fallback) : fallback;
      driverColumns.push({ name, values: header ? values.slice(1) : values, header, range: r, address: d.address });
    }
  }
  const timeData = timesHeader ? times.slice(1) : times;
  const priceData = pricesHeader ? prices.slice(1) : prices;

  // Trailing rows blank everywhere are the selection running past the data.
  let n = Math.max(timeData.length, priceData.length, ...driverColumns.map((d) => d.values.length));
  const blankAt = (i: number) => isBlank(timeData[i]) && isBlank(priceData[i]) && driverColumns.every((d) => isBlank(d.values[i]));
  while (n > 0 && blankAt(n - 1)) n--;
  if (n === 0) throw new InputError(`the timestamp range ${input.times.address} holds no data rows`);
  const short = (len: number) => len < n;
  if (short(timeData.length) || short(priceData.length) || driverColumns.some((d) => short(d.values.length))) {
    const sizes = [`timestamps ${timeData.length}`, `prices ${priceData.length}`, ...driverColumns.map((d) => `${d.name} ${d.values.length}`)];
    throw new InputError(`the ranges have different numbers of data rows (${sizes.join(', ')}); select the same rows in each`);
  }

  const seen = new Set<string>();
  for (const d of driverColumns) {
    let name = d.name, k = 2;
    while (seen.has(name.toLowerCase()) || /^(timestamp|price)$/i.test(name)) name = `${d.name}_${k++}`;
    d.name = name;
    seen.add(name.toLowerCase());
  }
  const header = ['timestamp', 'price', ...driverColumns.map((d) => d.name)];
  const firstRow = timesRange.row + 1 + (timesHeader ? 1 : 0);
  const read = timeReader(options.zone, options.dateSystem);
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  for (let i = 0; i < n; i++) {
    const row = firstRow + i;
    const everythingBlank = blankAt(i);
    if (isBlank(timeData[i])) {
      if (everythingBlank) continue; // an empty line inside the data keeps its place as a gap
      throw new InputError('has values but no timestamp; fill in the timestamp or clear the row', { file: source, row, column: 'timestamp' });
    }
    const ms = read(timeData[i], { file: source, row, column: 'timestamp' });
    rows.push([new Date(ms).toISOString(), cellText(priceData[i]), ...driverColumns.map((d) => cellText(d.values[i]))]);
    rowNumbers.push(row);
  }
  const dataAddress = (r: A1Range, headerRow: boolean, col = r.column, cols = 1) =>
    formatA1({ sheet: r.sheet, row: r.row + (headerRow ? 1 : 0), column: col, rows: n, columns: cols });
  const driverAddresses = input.drivers.map((d) => {
    const r = parseA1(d.address);
    const anyHeader = driverColumns.some((c) => c.address === d.address && c.header);
    return dataAddress(r, anyHeader, r.column, r.columns);
  });
  return {
    table: { source, header, rows, rowNumbers },
    layout: {
      times: dataAddress(timesRange, timesHeader),
      prices: dataAddress(pricesRange, pricesHeader),
      drivers: driverAddresses,
      driverNames: driverColumns.map((d) => d.name),
      rows: n,
    },
  };
}

/**
 * Reads the picked ranges through the port and builds the series with the
 * plain-language report of describeIngest.
 *
 * @throws InputError with one line for a bad address, a bad cell, a duplicate
 *   timestamp, periods off the grid, or an unknown zone
 */
export async function checkData(port: WorkbookPort, choice: RangeChoice, zone: string): Promise<DataCheck> {
  if (!choice.times.trim()) throw new InputError('pick the timestamp range first (select it and press "use selection", or type an address)');
  if (!choice.prices.trim()) throw new InputError('pick the price range first (select it and press "use selection", or type an address)');
  const dateSystem = await port.dateSystem();
  const readOne = async (address: string): Promise<RangeValues> => ({ address, values: await port.readRange(address) });
  parseA1(choice.times); parseA1(choice.prices); choice.drivers.forEach((d) => parseA1(d));
  const [times, prices, ...drivers] = await Promise.all([readOne(choice.times), readOne(choice.prices), ...choice.drivers.map(readOne)]);
  const { table, layout } = tableFromRanges({ times, prices, drivers }, { zone, dateSystem });
  const { series, report } = buildSeries(table, { zone });
  return { series, report, lines: describeIngest(series, report), layout, firstOpenRow: firstOpenRow(table) };
}

function firstOpenRow(table: Table): number | undefined {
  let last = -1;
  table.rows.forEach((r, i) => { if (r[1].trim() !== '') last = i; });
  return last >= 0 && last + 1 < table.rows.length ? table.rowNumbers[last + 1] : undefined;
}

function column(values: CellValue[][], c: number): CellValue[] {
  return values.map((row) => (row[c] === undefined ? null : row[c]));
}

function isBlank(v: CellValue | undefined): boolean {
  return v === null || v === undefined || (typeof v === 'string' && v.trim() === '');
}

/** A cell as the text the engine's number parser reads; booleans stay visible so they are refused. */
function cellText(v: CellValue | undefined): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'not a number';
  return String(v).trim();
}
