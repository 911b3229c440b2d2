/**
 * The class that reads holiday rules (date-holidays' Holidays, on top of
 * date-holidays-parser). In Node it is imported up front. The add-in's
 * browser build swaps this file for holiday-parser.browser.ts
 * (webpack.config.js), which fetches it as a chunk of its own when
 * prepareHolidays first needs it: with its calendars (lunar, Hebrew,
 * equinoxes) and time-zone tables it is the largest script the pane has.
 */
import Holidays from 'date-holidays';

export type HolidaysClass = typeof Holidays;

/** The class, or undefined while it is not loaded (never in Node). */
export function holidaysClass(): HolidaysClass | undefined {
  return Holidays;
}

export async function loadHolidaysClass(): Promise<HolidaysClass> {
  return Holidays;
}
