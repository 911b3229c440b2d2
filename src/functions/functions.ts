// Range arguments are `any[][]` on purpose: a `number[][]` one would turn empty cells into 0 (cells.ts).
import './runtime-shim';
import { prepareHolidays, type StoredModel } from '../engine';
import { boundModelStore, currentModelStore } from '../host/model-store';
import type { WorkbookPort } from '../host/workbook-port';
import { ahead as aheadCore } from './ahead';
import { band as bandCore } from './band';
import { baseline as baselineCore } from './baseline';
import { guarded } from './cell-error';
import { textArg } from './cells';
import { compare as compareCore } from './compare';
import { explain as explainCore } from './explain';
import { holiday as holidayCore } from './holiday';
import { modelFacts } from './model-facts';
import { score as scoreCore } from './score';
import type { DateSystem } from './timestamps';

// The LOOM cell functions. Each is a thin adapter: the host's range values
// in, the engine's result out as a number or a spill array, any failure as
// the host's error value with a message (cell-error.ts). The JSDoc of each
// function is the source of functions.json (custom-functions-metadata-plugin):
// its text is the function's help, each parameter line a parameter's help.
// (Plain comments here, so the generator does not read this as help text.)
// The build appends the `CustomFunctions.associate` calls to this file.

/**
 * Forecasts every delivery period of the day after the last known price with a model saved in this workbook; spills one column (23, 24 or 25 rows for hourly periods).
 * @customfunction AHEAD
 * @param model Name of a model saved in this workbook (Spotloom pane, section Models).
 * @param times Start time of each period: date-time cells (the model's market time) or text with UTC offset such as 2025-03-30T03:00:00+02:00. One column.
 * @param prices Price of each period, beside times; leave empty where unknown (tomorrow's rows).
 * @param [driverTimes] Start times of the driver rows, when the drivers are not on the rows of times.
 * @param [drivers] Driver forecasts the model was trained with (e.g. temperature, load), one column each in the model's order, or with their names in a first row.
 * @returns The forecasts, one per period of the next delivery day.
 */
export async function ahead(model: string, times: any[][], prices: any[][], driverTimes?: any[][], drivers?: any[][]): Promise<number[][]> {
  return guarded(async () => {
    const { stored, dateSystem } = await storedModel(model);
    return aheadCore(stored, { times, prices, driverTimes, drivers }, { dateSystem });
  });
}

/**
 * Lower and upper edge of the forecast band for every delivery period of the next day, from the model's recent errors; spills two columns beside LOOM.AHEAD.
 * @customfunction BAND
 * @param model Name of a model saved in this workbook.
 * @param times Start time of each period (as for LOOM.AHEAD).
 * @param prices Price of each period; empty where unknown.
 * @param [driverTimes] Start times of the driver rows, when the drivers are not on the rows of times.
 * @param [drivers] Driver forecasts the model was trained with.
 * @param [coverage] Share of prices the band should hold, between 0.5 and 1; default 0.9 (a 90 % band).
 * @returns Two columns: lower and upper edge, one row per period.
 */
export async function band(model: string, times: any[][], prices: any[][], driverTimes?: any[][], drivers?: any[][], coverage?: number): Promise<number[][]> {
  return guarded(async () => {
    const { stored, dateSystem } = await storedModel(model);
    return bandCore(stored, { times, prices, driverTimes, drivers }, coverage, { dateSystem });
  });
}

/**
 * A naive benchmark forecast of every delivery period of the day after the last known price; spills one column.
 * @customfunction BASELINE
 * @param times Start time of each period: date-time cells or text with UTC offset. One column.
 * @param prices Price of each period, beside times; empty where unknown.
 * @param [kind] "day" (the day before), "week" (a week before; the default) or "weekday-rule" (a week before on Monday, Saturday and Sunday, else the day before).
 * @param [zone] Time zone of the market, e.g. "Europe/Berlin" (the default) or "Australia/Adelaide".
 * @returns The baseline forecasts, one per period of the next delivery day.
 */
export async function baseline(times: any[][], prices: any[][], kind?: string, zone?: string): Promise<number[][]> {
  return guarded(async () => baselineCore(times, prices, kind, zone, { dateSystem: await dateSystem() }));
}

/**
 * An error score of a forecast against actual prices; empty cells are unknown and skipped.
 * @customfunction SCORE
 * @param actual Actual prices.
 * @param forecast Forecast prices, the same size as actual.
 * @param [metric] MAE (default), RMSE, SMAPE, MAPE, MASE, RMAE, BIAS or PINBALL.
 * @param [reference] RMAE: the reference forecast range. MASE: the season in periods (default 24). PINBALL: the quantile level of the forecast, e.g. 0.05.
 * @returns The score.
 */
export async function score(actual: any[][], forecast: any[][], metric?: string, reference?: any[][]): Promise<number> {
  return guarded(() => scoreCore(actual, forecast, metric, reference));
}

/**
 * Diebold-Mariano test on daily losses (HLN correction): the one-sided p-value for "forecast A is more accurate than forecast B"; small values (below 0.05) favour A.
 * @customfunction COMPARE
 * @param actual Actual prices, one row per period.
 * @param forecastA Forecast A, the same size as actual.
 * @param forecastB Forecast B, the same size as actual.
 * @param [loss] "abs" (absolute errors; the default) or "squared".
 * @param [days] How rows form delivery days: periods per day (default 24, counted from the first row), or the timestamps beside actual to group by their date.
 * @returns The p-value.
 */
export async function compare(actual: any[][], forecastA: any[][], forecastB: any[][], loss?: string, days?: any[][]): Promise<number> {
  return guarded(async () => compareCore(actual, forecastA, forecastB, loss, days, { dateSystem: await dateSystem() }));
}

/**
 * Name of the public holiday on a date in a region, or empty text on an ordinary day.
 * @customfunction HOLIDAY
 * @param date A date cell, or text such as 2025-10-03.
 * @param region Country, optionally with state: DE, DE-BY, FR, US-CA, AU-SA ...
 * @returns The holiday's name, or empty text.
 */
export async function holiday(date: any, region: string): Promise<string> {
  return guarded(async () => {
    await prepareHolidays(region); // the region's rules load on first use in the add-in
    return holidayCore(date, region, { dateSystem: await dateSystem() });
  });
}

/**
 * Facts about a model saved in this workbook: trained range, resolution, features, validation MAE, created, and more. Without a field, spills a two-column table of them all.
 * @customfunction MODEL
 * @param model Name of a model saved in this workbook.
 * @param [field] One fact: name, kind, trained_range, trained_from, trained_to, resolution, zone, features, drivers, region, validation_days, validation_mae, validation_mae_naive_week, neural_weight, coverage, created ...
 * @returns The fact, or a table of all facts.
 */
export async function model(model: string, field?: string): Promise<any[][]> {
  return guarded(async () => modelFacts((await storedModel(model)).stored, field));
}

/**
 * Why the next delivery day's mean forecast differs from the model's forecast of a reference day: spills two columns, input group and its contribution (largest first); the rows add up to the change.
 * @customfunction EXPLAIN
 * @param model Name of a model saved in this workbook (blend, neural or linear).
 * @param times Start time of each period (as for LOOM.AHEAD).
 * @param prices Price of each period; empty where unknown (tomorrow's rows).
 * @param [driverTimes] Start times of the driver rows, when the drivers are not on the rows of times.
 * @param [drivers] Driver forecasts the model was trained with.
 * @param [against] Reference day: "d-1" (the day before; the default) or "d-7" (the same weekday a week before).
 * @returns Two columns: input group and contribution in price units, one row per group.
 */
export async function explain(model: string, times: any[][], prices: any[][], driverTimes?: any[][], drivers?: any[][], against?: string): Promise<any[][]> {
  return guarded(async () => {
    const { stored, dateSystem } = await storedModel(model);
    return explainCore(stored, { times, prices, driverTimes, drivers }, against, { dateSystem });
  });
}

// ---- the workbook behind the functions -------------------------------------------

const dateSystems = new WeakMap<WorkbookPort, Promise<DateSystem>>();

async function storedModel(name: unknown): Promise<{ stored: StoredModel; dateSystem: DateSystem }> {
  const store = await boundModelStore();
  const { stored } = await store.load(textArg(name, 'model', ''));
  return { stored, dateSystem: await systemOf(store.port) };
}

/** The bound workbook's date system; the 1900 system while none is bound (the preview before it starts). */
async function dateSystem(): Promise<DateSystem> {
  const store = currentModelStore();
  return store ? systemOf(store.port) : '1900';
}

function systemOf(port: WorkbookPort): Promise<DateSystem> {
  let hit = dateSystems.get(port);
  if (!hit) {
    hit = port.dateSystem();
    dateSystems.set(port, hit);
    hit.catch(() => dateSystems.delete(port));
  }
  return hit;
}
