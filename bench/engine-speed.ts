// npm run bench (first part): how fast the engine's plumbing is. These were
// once timed tests, which flake on a busy machine; here they are measured and
// printed, not asserted. Each line: what, median of the runs, milliseconds.
import {
  addDays, buildSeries, createModel, dayContributions, DEMO_MARKET, explainAhead, frameBefore, generateMarket, groupedModelOf, holidayName, inputFrame, parseCsv, toCsv,
  type Learner,
} from '../src/engine';

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
  ...explainTimes(),
];
console.log(JSON.stringify({ engineSpeed: results }));

/**
 * The explanation of one day on the demo market (hourly, default feature
 * groups and network layout; few epochs, as training speed is not what is
 * measured): the 2^G forward passes alone, and the whole explainAhead
 * (which also forecasts the day once through predict). Goal: 200 ms.
 */
function explainTimes(): { what: string; ms: number }[] {
  const rows = generateMarket(DEMO_MARKET, 1);
  const { series } = buildSeries(parseCsv(toCsv(rows), 'demo.csv'), { zone: DEMO_MARKET.zone });
  const lastDay = rows.findIndex((r) => r.timestamp.startsWith(DEMO_MARKET.end));
  const open = { ...series, price: series.price.map((p, i) => (i >= lastDay ? NaN : p)) };
  const frame = inputFrame(open);
  const d = frame.price.length;
  const drivers = Object.keys(series.drivers);
  return (['linear', 'blend'] as const).flatMap((kind) => {
    const model = createModel(kind, { region: DEMO_MARKET.region, network: { ...createModelDefaults(), iterations: 5 } }) as Learner;
    model.fit(frameBefore(frame, d));
    const grouped = groupedModelOf(model);
    const players = grouped.groups.length;
    return [
      time(`explain one day, ${kind} hourly: ${2 ** players} forward passes (${players} groups)`, 5, () => dayContributions(grouped, frame, d, d - 1)),
      time(`explainAhead one day, ${kind} hourly (with its forecast)`, 5, () => explainAhead(model, open, drivers, 'd-1')),
    ];
  });
}

function createModelDefaults() {
  return (createModel('blend') as Learner).settings.network;
}
