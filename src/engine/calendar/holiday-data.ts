/**
 * The holiday rules the calendar answers from: the data object of the
 * `date-holidays` package (https://github.com/commenthol/date-holidays, data
 * under CC-BY-SA-3.0), `{ holidays: { CC: rules }, names: { … } }`, the very
 * object its Holidays class reads.
 *
 * In Node (command line, tests) it holds every country's rules from the
 * start. The add-in's browser build keeps its start-up script small: there
 * webpack.config.js puts an empty object in place of the package's data module
 * (holiday-data.browser.ts), and `prepareHolidays` adds one country's rules,
 * fetched as a chunk of their own (holiday-chunks.ts), together with the
 * class that reads them (holiday-parser.ts), before anything asks for
 * holidays of that country.
 *
 * @example await prepareHolidays('DE-BY'); holidayName('2025-08-15', 'DE-BY')
 */
import { data } from 'date-holidays/data';
import { LAZY_COUNTRIES, loadHolidayCountry, type HolidayRules } from './holiday-chunks';
import { holidaysClass, loadHolidaysClass } from './holiday-parser';

export const holidayData: HolidayRules = data;

const loading = new Map<string, Promise<void>>();

/**
 * Makes the rules of a region's country available to the synchronous
 * calendar functions (holidayName, isBridgeDay, …). Resolves at once when
 * they already are (always in Node); an empty or unknown region resolves too,
 * and the calendar function then refuses it with its usual message.
 *
 * @param region - `CC`, `CC-STATE` or `CC-STATE-REGION`, or undefined/empty for none
 */
export function prepareHolidays(region: string | undefined): Promise<void> {
  const country = countryOf(region);
  if (!country || (hasCountry(country) && holidaysClass())) return Promise.resolve();
  let hit = loading.get(country);
  if (!hit) {
    hit = Promise.all([loadHolidayCountry(country), loadHolidaysClass()]).then(([rules]) => {
      if (rules) {
        Object.assign(holidayData.holidays, rules.holidays);
        Object.assign(holidayData.names, rules.names);
      }
    });
    hit.catch(() => loading.delete(country));
    loading.set(country, hit);
  }
  return hit;
}

/**
 * True when `country` has rules that exist but are not loaded yet (only in
 * the browser build): asking for it then is a fault of ours, not of the input.
 */
export function holidaysPending(country: string): boolean {
  const c = country.toUpperCase();
  return !hasCountry(c) && LAZY_COUNTRIES.some((k) => k.toUpperCase() === c);
}

function hasCountry(country: string): boolean {
  return Object.keys(holidayData.holidays).some((k) => k.toUpperCase() === country);
}

function countryOf(region: string | undefined): string {
  return typeof region === 'string' ? region.trim().split('-')[0].toUpperCase() : '';
}
