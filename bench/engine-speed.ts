// npm run bench (first part): how fast the engine's plumbing is. These were
// once timed tests, which flake on a busy machine; here they are measured and
// printed, not asserted. Each line: what, median of the runs, milliseconds.
import { addDays, buildSeries, DEMO_MARKET, generateMarket, holidayName, parseCsv } from '../src/engine';

function median(times: number[]): number {
  const s = [...times].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time(what: string, runs: number, f: () => unknown): { what: string; ms: number } {
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t = performance.now();
    f();
    times.push(performance.now() - t);
  }
  const ms = median(times);
  console.log(`${what.padEnd(64)}${ms.toFixed(1).padStart(10)} ms`);
  return { what, ms };
}

const results = [
  time('generate the demo market (2.5 years hourly)', 3, () => generateMarket(DEMO_MARKET, 1)),
  time('refuse a file whose one row lies in 9999', 5, () => {
    try {
      buildSeries(parseCsv('timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,2\n9999-01-01T02:00Z,2\n', 'far.csv'), { zone: 'Europe/Berlin' });
    } catch { /* refused, as it should be */ }
  }),
  (() => {
    const days: string[] = [];
    for (let d = '2020-01-01'; d <= '2029-12-31'; d = addDays(d, 1)) days.push(d);
    holidayName(days[0], 'DE-NW');
    return time('holiday lookups, every day of ten years x 100 (DE-NW)', 3, () => {
      for (let r = 0; r < 100; r++) for (const d of days) holidayName(d, 'DE-NW');
    });
  })(),
  (() => {
    const step = 900_000, t0 = Date.parse('1999-12-31T23:00:00Z');
    const parts = ['timestamp,price,load_forecast'];
    for (let k = 0; k < 1_000_000; k++) parts.push(`${new Date(t0 + k * step).toISOString()},${((k * 7919) % 20011 / 100 - 50).toFixed(2)},${k % 977}`);
    const text = parts.join('\r\n');
    return time('read a CSV of 10^6 quarter-hours', 1, () => buildSeries(parseCsv(text, 'big.csv'), { zone: 'Europe/Berlin' }));
  })(),
];
console.log(JSON.stringify({ engineSpeed: results }));
