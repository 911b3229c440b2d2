import {
  byMagnitude, explainAhead, InputError, learnerFromStored, sensitivityAhead, withDriverStep,
  type DriverSensitivity, type DriverStep, type Explanation, type ReferenceChoice, type StoredModel,
} from '../../engine';
import { resizeAddress } from '../../host/a1';
import type { CellValue, NumberFormat } from '../../host/workbook-port';
import type { Block } from './place-layout';
import { PRICE_FORMAT } from './number-formats';
import type { DataCheck } from './read-ranges';
import { checkModelFits } from './tomorrow';

/** The "why" of tomorrow's forecast, as the Check section shows it: as it stands, and with a what-if step. */
export interface WhyTomorrow {
  model: string;
  base: Explanation;
  /** the same explanation with one driver changed on the forecast day */
  whatIf?: { step: DriverStep; explanation: Explanation };
  /** forecast change per unit of each driver, when asked for */
  sensitivity?: DriverSensitivity[];
}

/**
 * Explains tomorrow's forecast (the day after the last known price in Data)
 * against the model's forecast of D-1 or D-7, and, with a step, again with
 * that driver changed on tomorrow's periods. Nothing is written anywhere.
 *
 * @throws InputError when the model does not fit the data or cannot be explained
 */
export function whyTomorrow(stored: StoredModel, data: Pick<DataCheck, 'series'>, against: ReferenceChoice, step?: DriverStep, withSensitivity = false): WhyTomorrow {
  checkModelFits(stored, data);
  const source = `model "${stored.name}"`;
  const drivers = stored.setup.drivers;
  if (step && !drivers.includes(step.driver)) throw new InputError(`${source} does not use the driver "${step.driver}"; pick one of ${drivers.join(', ') || '(none)'}`);
  const base = explainAhead(learnerFromStored(stored, source), data.series, drivers, against);
  const whatIf = step && step.amount !== 0
    ? { step, explanation: explainAhead(learnerFromStored(stored, source), withDriverStep(data.series, base.day, step), drivers, against) }
    : undefined;
  const sensitivity = withSensitivity ? sensitivityAhead(learnerFromStored(stored, source), data.series, drivers).drivers : undefined;
  return { model: stored.name, base, whatIf, sensitivity };
}

/**
 * A what-if step from the pane's fields: "+10" with unit "percent" is
 * +10 %, "2" with unit "add" adds 2 in the driver's own unit; an empty
 * amount or no driver is no step.
 *
 * @throws InputError for an amount that is not a number
 */
export function parseStep(driver: string, amount: string, unit: string): DriverStep | undefined {
  const text = amount.trim().replace(/\s*%$/, '').replace(',', '.');
  if (!driver || text === '') return undefined;
  const n = Number(text);
  if (!Number.isFinite(n)) throw new InputError(`the what-if step must be a number such as +10 or -2, got "${amount}"`);
  return { driver, kind: unit === 'add' ? 'add' : 'percent', amount: n };
}

/** "load_forecast +10 %", "temperature_forecast -2 units" */
export function stepText(step: DriverStep): string {
  const sign = step.amount >= 0 ? '+' : '';
  return `${step.driver} ${sign}${step.amount}${step.kind === 'percent' ? ' %' : ' (own unit)'}`;
}

/** The explanation shown: the what-if's when there is one. */
export function shown(why: WhyTomorrow): Explanation {
  return why.whatIf?.explanation ?? why.base;
}

const SENSITIVITY_FORMAT = '0.0000';

/**
 * The table the pane places on a sheet at `anchor`: the reference day's
 * actual and forecast mean, tomorrow's forecast mean (and with a what-if,
 * the step and the mean without it), then input group and contribution,
 * largest first, and their sum; with sensitivities, a second small table.
 */
export function whyBlock(why: WhyTomorrow, anchor: string): Block {
  const e = shown(why);
  const rows: CellValue[][] = [];
  const formats: NumberFormat[][] = [];
  const add = (a: CellValue, b: CellValue, format: NumberFormat = PRICE_FORMAT) => { rows.push([a, b]); formats.push([null, typeof b === 'number' ? format : null]); };
  const num = (x: number): CellValue => (Number.isFinite(x) ? x : '');
  add(`why ${e.day} moves (model ${why.model}, against ${e.against})`, '');
  add(`${e.referenceDay}: actual mean`, num(e.referenceActualMean));
  add(`${e.referenceDay}: model's forecast mean`, num(e.referenceForecastMean));
  add(`${e.day}: forecast mean`, num(e.forecastMean));
  if (why.whatIf) {
    add('what-if', stepText(why.whatIf.step));
    add(`${e.day}: forecast mean without it`, num(why.base.forecastMean));
  }
  add('input group', 'contribution');
  for (const c of byMagnitude(e.contributions)) add(c.group, c.value);
  add('sum (change of the mean)', e.contributions.reduce((s, c) => s + c.value, 0));
  if (why.sensitivity?.length) {
    add('', '');
    add('driver', 'change per unit');
    for (const s of why.sensitivity) add(s.driver, s.mean, SENSITIVITY_FORMAT);
  }
  return { address: resizeAddress(anchor, rows.length, 2), values: rows, formats };
}
