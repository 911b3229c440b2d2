import seedrandom from 'seedrandom';
import { toWallClock, wallClockToSerial } from '../../src/engine';
import type { CellValue } from '../../src/host/workbook-port';

/**
 * An invented hourly history as a sheet would hold it: a header row, then
 * one row per delivery period with the start as a spreadsheet serial in
 * Berlin wall-clock time (so the repeated autumn hour appears twice), the
 * price and one driver ("load forecast"). The last `openDays` days have an
 * empty price, as tomorrow's rows do. No reference values come from it.
 */
export function historySheet(days: number, options: { openDays?: number; startUtc?: string; seed?: number } = {}): CellValue[][] {
  const { openDays = 1, startUtc = '2025-01-05T23:00:00Z', seed = 5 } = options;
  const rng = seedrandom(String(seed));
  const rows: CellValue[][] = [['timestamp', 'price', 'load forecast']];
  const t0 = Date.parse(startUtc);
  const n = days * 24;
  let noise = 0;
  for (let k = 0; k < n; k++) {
    const t = t0 + k * 3_600_000;
    const wall = toWallClock(t, 'Europe/Berlin');
    const hour = wall.minutes / 60;
    const weekday = new Date(t + 3_600_000).getUTCDay();
    const load = 50 + 20 * Math.sin(((hour - 7) / 24) * 2 * Math.PI) + (weekday % 6 === 0 ? -10 : 0) + 5 * rng();
    noise = 0.8 * noise + 3 * (rng() - 0.5);
    const price = 20 + 0.9 * load + noise;
    const open = k >= n - openDays * 24;
    rows.push([wallClockToSerial(wall), open ? null : Math.round(price * 100) / 100, Math.round(load * 100) / 100]);
  }
  return rows;
}
