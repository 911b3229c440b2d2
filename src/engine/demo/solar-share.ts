const DECEMBER_SOLSTICE_2000 = Date.UTC(2000, 11, 21, 13, 37); // from memory, ±1 h is immaterial here
const TROPICAL_YEAR_DAYS = 365.2422;

/**
 * Clear-sky solar output as a share of installed capacity (0 at night, about
 * 1 with the sun overhead), from the sun's elevation.
 *
 * Uses the usual textbook approximation: declination
 * δ = −23.44° · cos(2π (N + 10) / 365) with N the day of the year (counted
 * here from the December solstice of 2000), hour angle from UTC time and
 * longitude (equation of time ignored), and sin(elevation) =
 * sin φ sin δ + cos φ cos δ cos H. Output ∝ sin(elevation)^1.15 (a thicker
 * air mass near the horizon).
 *
 * @param utcMs - instant in UTC ms
 * @param latitude - degrees north (negative south)
 * @param longitude - degrees east (negative west)
 * @returns share of capacity in [0, 1]
 * @example solarShare(Date.UTC(2025, 5, 21, 11), 52.5, 13.4) // ≈ 0.8 (Berlin, noon, June)
 * @see https://en.wikipedia.org/wiki/Position_of_the_Sun (declination approximation)
 */
export function solarShare(utcMs: number, latitude: number, longitude: number): number {
  // N + 10 counts days from the December solstice; take it from a fixed solstice instant.
  const sinceSolstice = (utcMs - DECEMBER_SOLSTICE_2000) / 86_400_000;
  const decl = ((-23.44 * Math.PI) / 180) * Math.cos((2 * Math.PI * sinceSolstice) / TROPICAL_YEAR_DAYS);
  const utcHours = ((utcMs % 86_400_000) + 86_400_000) % 86_400_000 / 3_600_000;
  const hourAngle = ((utcHours + longitude / 15 - 12) * 15 * Math.PI) / 180;
  const phi = (latitude * Math.PI) / 180;
  const sinElev = Math.sin(phi) * Math.sin(decl) + Math.cos(phi) * Math.cos(decl) * Math.cos(hourAngle);
  return sinElev > 0 ? Math.pow(sinElev, 1.15) : 0;
}
