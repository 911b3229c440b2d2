import seedrandom from 'seedrandom';
import { addDays, dayStartUtc, toWallClock, wallClockToSerial } from '../../src/engine';
import type { CellValue } from '../../src/host/workbook-port';

/**
 * An invented hourly history as a sheet would hold it: a header row, then
 * one row per delivery period with the start as a spreadsheet serial in
 * Berlin wall-clock time (so the repeated autumn hour appears twice), the
 * price and one driver ("load forecast"), for `days` whole local days from
 * the local midnight `startUtc`. The last `openDays` days have an empty
 * price, as tomorrow's rows do. No reference values come from it.
 */
export function historySheet(days: number, options: { openDays?: number; startUtc?: string; seed?: number } = {}): CellValue[][] {
  const { openDays = 1, startUtc = '2025-01-05T23:00:00Z', seed = 5 } = options;
  const rng = seedrandom(String(seed));
  const rows: CellValue[][] = [['timestamp', 'price', 'load forecast']];
  const t0 = Date.parse(startUtc);
  const first = toWallClock(t0, 'Europe/Berlin').date;
  const end = dayStartUtc(addDays(first, days), 'Europe/Berlin');
  const openFrom = dayStartUtc(addDays(first, days - openDays), 'Europe/Berlin');
  let noise = 0;
  for (let t = t0; t < end; t += 3_600_000) {
    const wall = toWallClock(t, 'Europe/Berlin');
    const hour = wall.minutes / 60;
    const weekday = new Date(t + 3_600_000).getUTCDay();
    const load = 50 + 20 * Math.sin(((hour - 7) / 24) * 2 * Math.PI) + (weekday % 6 === 0 ? -10 : 0) + 5 * rng();
    noise = 0.8 * noise + 3 * (rng() - 0.5);
    const price = 20 + 0.9 * load + noise;
    const open = t >= openFrom;
    rows.push([wallClockToSerial(wall), open ? null : Math.round(price * 100) / 100, Math.round(load * 100) / 100]);
  }
  return rows;
}

/** The Data check of a fresh history sheet in a memory workbook (all three columns picked). */
export async function checkedHistory(days: number, options: Parameters<typeof historySheet>[1] = {}) {
  const { MemoryWorkbook } = await import('../../src/host/memory-workbook');
  const { checkData } = await import('../../src/pane/logic/read-ranges');
  const grid = historySheet(days, options);
  const port = new MemoryWorkbook({ sheets: { History: grid } });
  const n = grid.length;
  const data = await checkData(port, { times: `History!A1:A${n}`, prices: `History!B1:B${n}`, drivers: [`History!C1:C${n}`] }, 'Europe/Berlin');
  return { port, data, grid };
}

/** A linear model trained through the pane's own job runner, as its stored text. */
export async function trainedText(name = 'main', days = 130): Promise<string> {
  const { DEFAULT_LEARNER_SETTINGS } = await import('../../src/engine');
  const { runJob } = await import('../../src/pane/jobs/run-job');
  const { data } = await checkedHistory(days);
  let text = '';
  runJob({ type: 'train', series: data.series, settings: { ...DEFAULT_LEARNER_SETTINGS, kind: 'linear' }, name }, (r) => {
    if (r.type === 'trained') text = r.text;
    if (r.type === 'failed') throw new Error(r.message);
  });
  return text;
}
