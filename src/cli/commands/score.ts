import { compareForecasts, deliveryDays, InputError, scoreAll, type Series } from '../../engine';
import { intOption, loadSeries } from '../load-input';

export interface ScoreFlags {
  input: string;
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
 * Grades every forecast column of a file against its `actual` column.
 * The Diebold–Mariano test runs on one value per delivery day (the daily
 * mean absolute error difference), as is usual in the day-ahead literature.
 */
export async function scoreCommand(flags: ScoreFlags): Promise<void> {
  const { series } = loadSeries(flags.input, flags.tz, 'actual');
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
  if (flags.json) {
    process.stdout.write(`${JSON.stringify({ columns: result }, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v))}\n`);
    return;
  }
  const keys: (keyof ColumnScore)[] = ['mae', 'rmse', 'smape', 'mape', 'mase', 'bias', ...(reference ? (['rmae', 'dm_p'] as const) : [])];
  const width = Math.max(8, ...columns.map((c) => c.length));
  process.stdout.write(`${'column'.padEnd(width)} ${keys.map((k) => k.toUpperCase().replace('DM_P', 'DM p').padStart(10)).join(' ')}\n`);
  for (const name of columns) {
    const cells = keys.map((k) => {
      const v = result[name][k];
      return (v === undefined || !Number.isFinite(v) ? '-' : k === 'dm_p' ? v.toPrecision(3) : v.toFixed(3)).padStart(10);
    });
    process.stdout.write(`${name.padEnd(width)} ${cells.join(' ')}\n`);
  }
  if (reference) process.stdout.write(`rMAE and DM p against "${reference}"; DM p is one-sided: small means the column is more accurate than "${reference}".\n`);
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
