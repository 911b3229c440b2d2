import { DateTime } from 'luxon';

/**
 * ISO 8601 with the market's local UTC offset, the form the data file uses.
 *
 * @example formatTimestamp(1743296400000, 'Europe/Berlin') // '2025-03-30T03:00:00+02:00'
 */
export function formatTimestamp(ms: number, zone: string): string {
  return DateTime.fromMillis(ms, { zone }).toISO({ suppressMilliseconds: true }) as string;
}
