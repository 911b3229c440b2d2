import { holidayName, InputError } from '../engine';
import { cellList, isBlank, textArg } from './cells';
import { readDate, type DateSystem } from './timestamps';

/**
 * LOOM.HOLIDAY: the name of the public holiday on a date in a region, or
 * an empty text when it is an ordinary day (the engine's holiday calendar:
 * public, whole-day holidays of the date-holidays data).
 *
 * @param date a date cell (serial; the time of day is ignored) or text YYYY-MM-DD
 * @param region CC, CC-STATE or CC-STATE-REGION, e.g. DE, DE-BY, US-CA
 * @example holiday(45933, 'DE') // 'Tag der Deutschen Einheit' (2025-10-03)
 */
export function holiday(date: unknown, region: unknown, options: { dateSystem?: DateSystem } = {}): string {
  const cell = Array.isArray(date) ? cellList(date, 'date')[0] : date;
  if (isBlank(cell)) throw new InputError('date is empty; give a date cell or text like 2025-10-03');
  const code = textArg(region, 'region', '');
  if (code === '') throw new InputError('give a region such as DE, DE-BY, FR or US-CA');
  return holidayName(readDate(cell, 'date', options.dateSystem), code);
}
