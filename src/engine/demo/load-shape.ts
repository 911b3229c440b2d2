/**
 * Kinds of delivery day for demand: ordinary working day, Saturday, Sunday or
 * public holiday, and "bridge" for days many people take off (bridge days,
 * working days from 24 December to 2 January).
 */
export type DayKind = 'working' | 'saturday' | 'sunday' | 'bridge';

const bump = (h: number, centre: number, width: number): number => Math.exp(-0.5 * ((h - centre) / width) ** 2);
/** bump on the 24-hour circle, so the night dip joins 23:59 to 00:00 */
const nightDip = (h: number): number => {
  const d = Math.min(Math.abs(h - 3.5), 24 - Math.abs(h - 3.5));
  return Math.exp(-0.5 * (d / 2.2) ** 2);
};
const rise = (h: number, at: number, width: number): number => 1 / (1 + Math.exp(-(h - at) / width));

/**
 * Invented daily demand profile: share of the base load at a local clock hour.
 *
 * Working days: night trough near 0.67 around 03:30, morning ramp with a
 * peak near 09:00, midday plateau, evening peak near 18:30 (≈ 1.04).
 * Saturdays start later and lower; Sundays and holidays are lowest; bridge
 * days lie halfway between a working day and a Saturday. Common practice
 * for the shape of system load; numbers are invented.
 *
 * @param clockHour - local clock time in hours, 0 ≤ h < 24
 * @param kind - the kind of day
 * @returns share of base load (≈ 0.6 … 1.05)
 * @example loadShape(18.5, 'working') // ≈ 1.04
 */
export function loadShape(clockHour: number, kind: DayKind): number {
  const h = clockHour;
  const evening = 1 - rise(h, 21.3, 0.8);
  const night = 0.05 * nightDip(h);
  switch (kind) {
    case 'working':
      return 0.72 - night + 0.27 * rise(h, 6.3, 0.8) * evening + 0.05 * bump(h, 9, 1.5) + 0.09 * bump(h, 18.5, 1.7);
    case 'saturday':
      return 0.72 - night + 0.19 * rise(h, 7.5, 1.0) * evening + 0.03 * bump(h, 11.5, 2) + 0.07 * bump(h, 18.5, 1.7);
    case 'sunday':
      return 0.71 - night + 0.15 * rise(h, 8, 1.1) * evening + 0.03 * bump(h, 12, 2) + 0.07 * bump(h, 18.8, 1.7);
    case 'bridge':
      return 0.5 * (loadShape(h, 'working') + loadShape(h, 'saturday'));
  }
}
