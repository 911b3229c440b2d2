import {
  byMagnitude, explainAhead, InputError, learnerFromStored, parseStoredModel, REFERENCE_CHOICES, sensitivityAhead,
  type Explanation, type ReferenceChoice, type StoredModel,
} from '../../engine';
import { loadModelInput, readText, type DialectFlags } from '../load-input';

export interface ExplainFlags extends DialectFlags {
  model: string;
  input: string;
  drivers?: string;
  against: string;
  tz?: string;
  sensitivity?: boolean;
  json?: boolean;
}

/** The unit of every number explain prints: the input's price column's. */
const UNIT = 'currency/MWh';

/**
 * Why the next delivery day's forecast differs from the model's forecast of
 * D-1 (or D-7): one contribution per input group, adding up to the change
 * of the day's mean forecast (engine/explain). The input is read exactly as
 * `forecast` reads it.
 */
export async function explainCommand(flags: ExplainFlags): Promise<void> {
  if (!(REFERENCE_CHOICES as readonly string[]).includes(flags.against)) throw new InputError(`--against must be d-1 or d-7, got "${flags.against}"`);
  const stored = parseStoredModel(readText(flags.model), flags.model);
  if (flags.tz !== undefined && flags.tz !== stored.zone) {
    throw new InputError(`--tz ${flags.tz} differs from the zone the model was trained in (${stored.zone}); leave --tz out or train the model in that zone`);
  }
  const learner = learnerFromStored(stored, flags.model);
  const series = loadModelInput(stored, flags);
  const e = explainAhead(learner, series, stored.setup.drivers, flags.against as ReferenceChoice);
  const sensitivity = flags.sensitivity ? sensitivityAhead(learnerFromStored(stored, flags.model), series, stored.setup.drivers).drivers : undefined;

  if (flags.json) {
    process.stdout.write(`${JSON.stringify({
      model: stored.name, kind: stored.settings.kind, day: e.day, reference_day: e.referenceDay, against: e.against, unit: UNIT,
      forecast_mean: e.forecastMean, reference_forecast_mean: e.referenceForecastMean,
      reference_actual_mean: Number.isNaN(e.referenceActualMean) ? null : e.referenceActualMean,
      reference_error: Number.isNaN(e.referenceError) ? null : e.referenceError,
      change: e.change,
      contributions: e.contributions.map((c) => ({ group: c.group, value: c.value, per_slot: c.perSlot })),
      forecast_per_slot: e.forecast, reference_per_slot: e.reference,
      ...(sensitivity ? { sensitivity: sensitivity.map((s) => ({ driver: s.driver, per_unit: s.mean, per_slot: s.perSlot, step: s.step })) } : {}),
    })}\n`);
  } else {
    process.stdout.write(readable(e, stored));
    if (sensitivity) {
      process.stdout.write(`\nforecast change per unit of each driver on ${e.day} (${UNIT} per driver unit, moved on every period):\n`);
      for (const s of sensitivity) process.stdout.write(`  ${s.driver.padEnd(24)}${signed(s.mean, 4).padStart(12)}\n`);
    }
  }
  process.stderr.write(`explain: ${e.day} against ${e.referenceDay} (${e.against}) with model "${stored.name}" (${stored.settings.kind}); contributions are exact Shapley values over the input groups and add up to the change.\n`);
}

/** "today was 80, the model said 78, tomorrow 92: +9 drivers_target, +4 ..." as a small table, largest first. */
function readable(e: Explanation, stored: StoredModel): string {
  const lines: string[] = [];
  const actual = Number.isNaN(e.referenceActualMean) ? 'no known price' : `actual mean ${e.referenceActualMean.toFixed(2)}`;
  const error = Number.isNaN(e.referenceError) ? '' : ` (error ${signed(e.referenceError)})`;
  lines.push(`${e.referenceDay} (${e.against}): ${actual}; the model said ${e.referenceForecastMean.toFixed(2)}${error}`);
  lines.push(`${e.day}: forecast mean ${e.forecastMean.toFixed(2)}, change ${signed(e.change)} ${UNIT} (model "${stored.name}")`);
  lines.push('');
  const width = Math.max(12, ...e.contributions.map((c) => c.group.length)) + 2;
  lines.push(`${'input group'.padEnd(width)}${`contribution (${UNIT})`.padStart(28)}`);
  for (const c of byMagnitude(e.contributions)) lines.push(`${c.group.padEnd(width)}${signed(c.value).padStart(28)}`);
  lines.push(`${'sum'.padEnd(width)}${signed(e.contributions.reduce((s, c) => s + c.value, 0)).padStart(28)}`);
  return `${lines.join('\n')}\n`;
}

function signed(v: number, digits = 2): string {
  const t = v.toFixed(digits);
  return v >= 0 && !t.startsWith('-') ? `+${t}` : t;
}
