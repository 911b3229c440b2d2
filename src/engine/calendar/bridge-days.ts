/**
 * Bridge days: a working day squeezed between a holiday and a weekend (or
 * between two holidays), which many people take off, so demand on it looks
 * more like a holiday than a working day.
 *
 * Rule used (common practice in German-speaking markets, "Brückentag"):
 * a date is a bridge day when it is Monday–Friday, not itself a public
 * holiday, and both its neighbours are days off (Saturday, Sunday or a public
 * holiday) with at least one of them a public holiday. Examples: the Friday
 * after a Thursday holiday (Ascension Day), the Monday before a Tuesday
 * holiday. Only one-day gaps count; a Thursday + Friday between a Wednesday
 * holiday and the weekend are not bridge days under this rule.
 */
import { holidayName } from './holidays';
import { addDays, isoWeekday } from './weekday';

/**
 * Whether a local calendar date is a bridge day in a region.
 *
 * @param date - local calendar date `YYYY-MM-DD`
 * @param region - holiday region as for `holidayName`, e.g. `DE`, `DE-BY`
 * @returns true for a one-day working gap between a holiday and a weekend (or two holidays)
 * @throws InputError when `date` is not a real date or `region` is unknown
 * @example isBridgeDay('2025-05-30', 'DE') // true: Friday after Ascension Day (Thu 29 May)
 */
export function isBridgeDay(date: string, region: string): boolean {
  const weekday = isoWeekday(date);
  if (weekday > 5 || holidayName(date, region) !== '') return false;
  const before = addDays(date, -1);
  const after = addDays(date, 1);
  const beforeHoliday = holidayName(before, region) !== '';
  const afterHoliday = holidayName(after, region) !== '';
  const beforeOff = beforeHoliday || weekday === 1; // Monday's neighbour before is Sunday
  const afterOff = afterHoliday || weekday === 5; // Friday's neighbour after is Saturday
  return beforeOff && afterOff && (beforeHoliday || afterHoliday);
}
