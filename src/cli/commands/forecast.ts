import { forecastAhead, formatTimestamp, InputError, learnerFromStored, parseStoredModel } from '../../engine';
import { loadSeries, readText } from '../load-input';
import { writeCsv } from '../write-csv';

export interface ForecastFlags {
  model: string;
  input: string;
  out?: string;
  json?: boolean;
}

export async function forecastCommand(flags: ForecastFlags): Promise<void> {
  const stored = parseStoredModel(readText(flags.model), flags.model);
  const learner = learnerFromStored(stored, flags.model);
  const { series } = loadSeries(flags.input, stored.zone);
  if (series.resolution !== stored.resolution) {
    throw new InputError(`has ${series.resolution}-minute periods but the model was trained on ${stored.resolution}-minute periods`, { file: flags.input });
  }
  const missing = stored.setup.drivers.filter((d) => !(d in series.drivers));
  if (missing.length) throw new InputError(`lacks the driver column "${missing[0]}" the model was trained with`, { file: flags.input });
  const { rows, days, notes } = forecastAhead(learner, series, stored.setup.drivers);
  for (const note of notes) process.stderr.write(`forecast: ${note}\n`);
  if (flags.out) {
    writeCsv(flags.out, ['timestamp', 'forecast', 'lower', 'upper'], rows.map((r) => [formatTimestamp(r.time, stored.zone), r.forecast, r.lower, r.upper]));
  }
  if (flags.json) {
    const out = rows.map((r) => ({ timestamp: formatTimestamp(r.time, stored.zone), forecast: r.forecast, lower: r.lower, upper: r.upper }));
    process.stdout.write(`${JSON.stringify({ model: stored.name, kind: stored.settings.kind, days, coverage: stored.settings.coverage, rows: out })}\n`);
    return;
  }
  if (!flags.out) {
    process.stdout.write(`timestamp,forecast,lower,upper\n`);
    for (const r of rows) process.stdout.write(`${formatTimestamp(r.time, stored.zone)},${r.forecast.toFixed(2)},${r.lower.toFixed(2)},${r.upper.toFixed(2)}\n`);
  }
  process.stderr.write(`forecast: ${rows.length} periods for ${days.join(', ')} with ${Math.round(stored.settings.coverage * 100)} % bands. Forecasts are estimates with stated error, not trading advice.\n`);
}
