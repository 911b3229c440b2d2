const HHMM: string[] = Array.from(
  { length: 1440 },
  (_, m) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`,
);

/**
 * ISO 8601 text of a local wall-clock time with its UTC offset, the form the
 * data file uses (ISO 8601-1:2019, 5.4: date, time of day and UTC offset).
 *
 * @param date - local calendar date `YYYY-MM-DD`
 * @param clockMinutes - local clock time, whole minutes after midnight (0 … 1439)
 * @param offsetMinutes - local UTC offset in minutes (e.g. 120, 630, -360)
 * @returns e.g. `2025-03-30T03:00:00+02:00`
 * @example localTimestamp('2025-03-30', 180, 120) // '2025-03-30T03:00:00+02:00'
 */
export function localTimestamp(date: string, clockMinutes: number, offsetMinutes: number): string {
  const a = Math.abs(offsetMinutes);
  return `${date}T${HHMM[clockMinutes]}:00${offsetMinutes < 0 ? '-' : '+'}${HHMM[a]}`;
}
