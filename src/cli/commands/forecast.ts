import {
  forecastAhead, formatTimestamp, learnerFromStored, parseStoredModel, plural, toWallClock, type StoredModel,
} from '../../engine';
import { loadModelInput, readText, type DialectFlags } from '../load-input';
import { writeCsv } from '../write-csv';

export interface ForecastFlags extends DialectFlags {
  model: string;
  input: string;
  /** the forecast day's driver rows in a file of their own */
  drivers?: string;
  out?: string;
  json?: boolean;
}

/**
 * Forecasts the delivery day(s) after the last known price and says which
 * day, when it was issued and by which model; a delivery day that has
 * already begun is named as such, so a stale file is never mistaken for
 * tomorrow's forecast.
 *
 * @param now the clock (UTC ms), passed in so that tests can fix it
 */
export async function forecastCommand(flags: ForecastFlags, now: () => number = Date.now): Promise<void> {
  const stored = parseStoredModel(readText(flags.model), flags.model);
  const learner = learnerFromStored(stored, flags.model);
  const series = loadModelInput(stored, flags);
  const { rows, days, notes } = forecastAhead(learner, series, stored.setup.drivers);
  const issuedAt = now();
  const issued = formatTimestamp(Math.floor(issuedAt / 1000) * 1000, stored.zone);
  const today = toWallClock(issuedAt, stored.zone).date;
  const started = days.filter((d) => d <= today);

  for (const note of notes) process.stderr.write(`forecast: ${note}\n`);
  if (flags.out) {
    writeCsv(flags.out, ['timestamp', 'forecast', 'lower', 'upper'], rows.map((r) => [formatTimestamp(r.time, stored.zone), r.forecast, r.lower, r.upper]));
  }
  if (flags.json) {
    const out = rows.map((r) => ({ timestamp: formatTimestamp(r.time, stored.zone), forecast: r.forecast, lower: r.lower, upper: r.upper }));
    process.stdout.write(`${JSON.stringify({
      model: stored.name, kind: stored.settings.kind, trained_from: stored.trainedFrom, trained_to: stored.trainedTo,
      days, issued_at: issued, days_begun: started, coverage: stored.settings.coverage, rows: out,
    })}\n`);
  } else if (!flags.out) {
    process.stdout.write(`timestamp,forecast,lower,upper\n`);
    for (const r of rows) process.stdout.write(`${formatTimestamp(r.time, stored.zone)},${r.forecast.toFixed(2)},${r.lower.toFixed(2)},${r.upper.toFixed(2)}\n`);
  }
  process.stderr.write(`forecast: ${whatWasIssued(stored, days, rows.length, issued)}${flags.out ? `, written to ${flags.out}` : ''}.\n`);
  if (started.length) process.stderr.write(`forecast: ${begun(started, today, stored.zone)}\n`);
  process.stderr.write('forecast: forecasts are estimates with stated error, not trading advice.\n');
}

/** "delivery day 2026-11-30 (24 periods, Europe/Berlin), issued … by model "m" (linear, trained on 2024-06-01 to 2026-11-29), 90 % bands" */
function whatWasIssued(stored: StoredModel, days: string[], periods: number, issued: string): string {
  const which = days.length === 1 ? `delivery day ${days[0]}` : `delivery days ${days.join(', ')}`;
  return `${which} (${plural(periods, 'period')}, ${stored.zone}), issued ${issued} by model "${stored.name}" ` +
    `(${stored.settings.kind}, trained on ${stored.trainedFrom} to ${stored.trainedTo}), ${Math.round(stored.settings.coverage * 100)} % bands`;
}

/** The plain warning for delivery days whose day-ahead auction is already over. */
function begun(started: string[], today: string, zone: string): string {
  const one = started.length === 1;
  const state = started.every((d) => d < today) ? 'already past' : started.every((d) => d === today) ? 'today' : 'today or already past';
  return `note: delivery day${one ? '' : 's'} ${started.join(', ')} ${one ? 'is' : 'are'} ${state} (today is ${today} in ${zone}): ` +
    `the day-ahead auction for ${one ? 'it' : 'them'} is over, so this forecast can no longer be traded on. ` +
    'If you meant tomorrow, the history is stale: give prices up to today and tomorrow\'s driver forecasts.';
}
