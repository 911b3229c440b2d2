/**
 * The browser build's holiday-parser.ts (webpack.config.js swaps it in): the
 * date-holidays class is fetched as a lazy chunk by loadHolidaysClass, which
 * prepareHolidays calls before any holiday is asked for.
 */
import type Holidays from 'date-holidays';

export type HolidaysClass = typeof Holidays;

let loaded: HolidaysClass | undefined;

export function holidaysClass(): HolidaysClass | undefined {
  return loaded;
}

export async function loadHolidaysClass(): Promise<HolidaysClass> {
  loaded ??= (await import(/* webpackChunkName: "holiday-parser" */ 'date-holidays')).default;
  return loaded;
}
