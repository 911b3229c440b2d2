/**
 * Where the browser build fetches one country's holiday rules from. In Node
 * every country is in holiday-data.ts from the start, so this module has no
 * country to load. The add-in's build (webpack.config.js) replaces this
 * file's contents with scripts/holiday-chunks-loader.cjs's output: the list of
 * the package's countries and, per country, a dynamic import of a chunk
 * holding that country's rules (with those of the countries they refer to,
 * e.g. GU's to US) and the shared holiday names.
 */

/** date-holidays' data layout, as far as the calendar touches it. */
export interface HolidayRules {
  holidays: Record<string, unknown>;
  names: Record<string, unknown>;
}

/** Country codes whose rules load on demand (none in Node). */
export const LAZY_COUNTRIES: readonly string[] = [];

/** The rules of one country (letter case free), or undefined when there is no such chunk. */
export async function loadHolidayCountry(country: string): Promise<HolidayRules | undefined> {
  void country;
  return undefined;
}
