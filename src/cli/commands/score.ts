import { compareForecasts, deliveryDays, InputError, scoreAll, type Series } from '../../engine';
import { dialectChoice, intOption, loadScoreInput, type DialectFlags } from '../load-input';

export interface ScoreFlags extends DialectFlags {
  input: string;
  /** a data file whose prices are the actual column (for a file that forecast --out wrote) */
  actuals?: string;
  against?: string;
  season?: string;
  tz: string;
  json?: boolean;
}

interface ColumnScore {
  mae: number; rmse: number; smape: number; mape: number; mase: number; bias: number;
  rmae?: number; dm_p?: number;
}

/**
 * Grades every forecast column of a file against its `actual` column (or,
 * with `--actuals`, against the prices of another data file). The
 * Diebold–Mariano test runs on one value per delivery day (the daily mean
 * absolute error difference), as is usual in the day-ahead literature.
 * Columns `lower` and `upper` (the band that forecast and backtest write)
 * are also reported as a band: the share of actual prices inside it.
 */
export async function scoreCommand(flags: ScoreFlags): Promise<void> {
  const { series } = loadScoreInput({ input: flags.input, actuals: flags.actuals }, flags.tz, dialectChoice(flags));
  const columns = Object.keys(series.drivers);
  if (columns.length === 0) throw new InputError('has no forecast column beside timestamp and actual', { file: flags.input });
  const season = intOption(flags.season, '--season', 1, 1440 / series.resolution);
  const reference = flags.against === undefined ? undefined : findColumn(series, flags.against, flags.input);
  const dayOf = dayIndexOfPeriods(series);
  const result: Record<string, ColumnScore> = {};
  for (const name of columns) {
    const forecast = series.drivers[name];
    const s = scoreAll(series.price, forecast, { season, reference: reference ? series.drivers[reference] : undefined });
    const score: ColumnScore = { mae: s.mae, rmse: s.rmse, smape: s.smape, mape: s.mape, mase: s.mase, bias: s.bias };
    if (reference && name !== reference) {
      score.rmae = s.rmae;
      score.dm_p = compareForecasts(series.price, forecast, series.drivers[reference], dayOf, 'abs').pValue;
    }
    result[name] = score;
  }
  const band = bandOf(series);
  if (flags.json) {
    process.stdout.write(`${JSON.stringify({ columns: result, ...(band ? { band: { coverage: band.coverage, periods: band.periods } } : {}) }, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v))}\n`);
    return;
  }
  const shown = band ? columns.filter((c) => c !== band.lower && c !== band.upper) : columns;
  const keys: (keyof ColumnScore)[] = ['mae', 'rmse', 'smape', 'mape', 'mase', 'bias', ...(reference ? (['rmae', 'dm_p'] as const) : [])];
  const width = Math.max(8, ...shown.map((c) => c.length));
  process.stdout.write(`${'column'.padEnd(width)} ${keys.map((k) => k.toUpperCase().replace('DM_P', 'DM p').padStart(10)).join(' ')}\n`);
  for (const name of shown) {
    const cells = keys.map((k) => {
      const v = result[name][k];
      return (v === undefined || !Number.isFinite(v) ? '-' : k === 'dm_p' ? v.toPrecision(3) : v.toFixed(3)).padStart(10);
    });
    process.stdout.write(`${name.padEnd(width)} ${cells.join(' ')}\n`);
  }
  if (band) {
    process.stdout.write(`band ${band.lower}..${band.upper}: ${band.inside} of ${band.periods} actual prices inside (${band.periods ? (100 * band.coverage).toFixed(1) : '-'} %)\n`);
  }
  if (reference) process.stdout.write(`rMAE and DM p against "${reference}"; DM p is one-sided: small means the column is more accurate than "${reference}".\n`);
}

/** The band columns `lower` and `upper` beside at least one forecast column, and how many actual prices fell inside. */
function bandOf(series: Series): { lower: string; upper: string; inside: number; periods: number; coverage: number } | undefined {
  const names = Object.keys(series.drivers);
  const lower = names.find((c) => c.toLowerCase() === 'lower');
  const upper = names.find((c) => c.toLowerCase() === 'upper');
  if (!lower || !upper || names.length < 3) return undefined;
  let inside = 0, periods = 0;
  series.price.forEach((a, i) => {
    const lo = series.drivers[lower][i], hi = series.drivers[upper][i];
    if (Number.isNaN(a) || Number.isNaN(lo) || Number.isNaN(hi)) return;
    periods++;
    if (a >= lo && a <= hi) inside++;
  });
  return { lower, upper, inside, periods, coverage: periods ? inside / periods : NaN };
}

function findColumn(series: Series, name: string, file: string): string {
  const match = Object.keys(series.drivers).find((c) => c.toLowerCase() === name.toLowerCase());
  if (!match) throw new InputError(`--against "${name}" is not a column of the file (columns: ${Object.keys(series.drivers).join(', ')})`, { file });
  return match;
}

function dayIndexOfPeriods(series: Series): number[] {
  const dayOf = new Array<number>(series.times.length);
  deliveryDays(series).forEach((day, d) => { for (let j = 0; j < day.count; j++) dayOf[day.start + j] = d; });
  return dayOf;
}
