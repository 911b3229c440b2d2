import { readFileSync } from 'node:fs';
import {
  buildSeries, buildSeriesWithActuals, buildSeriesWithDrivers, describeDialect, describeIngest, formatTimestamp, InputError, parseCsv, parseDecimalMark,
  parseDelimiter, plural, type DialectChoice, type IngestReport, type Series, type StoredModel, type Table,
} from '../engine';

/** The command-line flags that fix a data file's dialect (detected when left out). */
export interface DialectFlags {
  delimiter?: string;
  decimal?: string;
}

/** `--delimiter` and `--decimal`, checked. */
export function dialectChoice(flags: DialectFlags): DialectChoice {
  return {
    delimiter: flags.delimiter === undefined ? undefined : flagValue('--delimiter', () => parseDelimiter(flags.delimiter!)),
    decimal: flags.decimal === undefined ? undefined : flagValue('--decimal', () => parseDecimalMark(flags.decimal!)),
  };
}

/**
 * Reads a data file as a table in the dialect it was written in
 * (engine/series/table.ts) and says on stderr when that is not the plain
 * one, e.g. "prices.csv: read as ';'-separated with decimal commas".
 */
export function readTableFile(file: string, dialect: DialectChoice = {}): Table {
  const table = parseCsv(readText(file), file, dialect);
  const line = table.dialect && describeDialect(table.dialect);
  if (line) process.stderr.write(`${file}: ${line}\n`);
  return table;
}

/**
 * Reads a data file as design.md describes it and says on stderr what was
 * found (dialect, periods, resolution, gaps, missing prices), so nothing is
 * dropped or filled without the user being told.
 */
export function loadSeries(file: string, zone: string, target = 'price', missing = 'fill', dialect: DialectChoice = {}): { series: Series; report: IngestReport } {
  checkMissingRule(missing);
  const result = buildSeries(readTableFile(file, dialect), { zone, target });
  return reported(result, file, zone, missing);
}

/**
 * The input of a forecast (and of `explain`): the history file, and when
 * `drivers` is given the forecast day's driver rows from a file of their
 * own, joined into one series equal to the one-file form (history with
 * those rows appended with empty prices; engine/series/join-drivers.ts).
 */
export function loadForecastInput(files: { input: string; drivers?: string }, zone: string, dialect: DialectChoice = {}): { series: Series; report: IngestReport } {
  if (files.drivers === undefined) return loadSeries(files.input, zone, 'price', 'fill', dialect);
  const history = readTableFile(files.input, dialect);
  const drivers = readTableFile(files.drivers, dialect);
  const result = buildSeriesWithDrivers(history, drivers, { zone });
  return reported(result, `${files.input} + ${files.drivers}`, zone, 'fill');
}

/**
 * The series a stored model forecasts or explains from (loadForecastInput
 * in the model's zone), refused when its periods or driver columns do not
 * fit the model.
 */
export function loadModelInput(stored: StoredModel, flags: { input: string; drivers?: string } & DialectFlags): Series {
  const { series } = loadForecastInput({ input: flags.input, drivers: flags.drivers }, stored.zone, dialectChoice(flags));
  if (series.resolution !== stored.resolution) {
    throw new InputError(`has ${series.resolution}-minute periods but the model was trained on ${stored.resolution}-minute periods`, { file: flags.input });
  }
  const missing = stored.setup.drivers.filter((d) => !(d in series.drivers));
  if (missing.length) throw new InputError(`lacks the driver column "${missing[0]}" the model was trained with`, { file: flags.drivers ?? flags.input });
  return series;
}

/**
 * The input of `score`: a file with timestamp, actual and forecast columns,
 * or with `actuals` given, a file of issued forecasts (as `forecast --out`
 * writes it) whose actual column comes from that data file's prices.
 */
export function loadScoreInput(files: { input: string; actuals?: string }, zone: string, dialect: DialectChoice = {}): { series: Series; report: IngestReport } {
  if (files.actuals === undefined) return loadSeries(files.input, zone, 'actual', 'fill', dialect);
  const { series: prices } = loadSeries(files.actuals, zone, 'price', 'fill', dialect);
  const { series, report, unmatched } = buildSeriesWithActuals(readTableFile(files.input, dialect), prices, { zone });
  if (unmatched === report.rows) {
    throw new InputError(`none of its ${plural(report.rows, 'period')} has a price in ${files.actuals}; check that the two files cover the same delivery day`, { file: files.input });
  }
  if (unmatched > 0) {
    process.stderr.write(`${files.input}: ${plural(unmatched, 'period')} of ${report.rows} ${unmatched === 1 ? 'has' : 'have'} no price in ${files.actuals} yet; scores skip ${unmatched === 1 ? 'it' : 'them'}\n`);
  }
  return { series, report };
}

function reported(result: { series: Series; report: IngestReport }, label: string, zone: string, missing: string) {
  const { series, report } = result;
  if (missing === 'fail' && report.missingPrices > 0) {
    const i = series.price.findIndex(Number.isNaN);
    throw new InputError(
      `${plural(report.missingPrices, 'period')} inside the history ${report.missingPrices === 1 ? 'has' : 'have'} no price, the first at ${formatTimestamp(series.times[i], zone)} (--missing fail); fill them or use --missing fill`,
      { file: label },
    );
  }
  for (const line of describeIngest(series, report)) process.stderr.write(`${label}: ${line}\n`);
  return result;
}

function checkMissingRule(missing: string): void {
  if (missing !== 'fill' && missing !== 'fail') throw new InputError(`--missing must be fill or fail, got "${missing}"`);
}

function flagValue<T>(flag: string, read: () => T): T {
  try {
    return read();
  } catch (err) {
    if (err instanceof InputError) throw new InputError(`${flag}: ${err.message}`);
    throw err;
  }
}

export function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? 'no such file' : `cannot be read (${code ?? 'unknown error'})`, { file });
  }
}

/** A whole-number option, checked: `--retrain-every abc` is a clear error. */
export function intOption(value: string | undefined, flag: string, min: number, fallback: number): number {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < min) throw new InputError(`${flag} must be a whole number of at least ${min}, got "${value}"`);
  return n;
}
