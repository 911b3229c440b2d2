import fc from 'fast-check';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { buildSeries, deliveryDays, InputError, MAX_PERIODS, MISSING_MARKERS, parseCsv, toWallClock, wallClockToUtc, type Series } from '../../src/engine';
import { outcome, params, ZONES } from './support';

/**
 * parseCsv + buildSeries on generated files. Each file is planned first
 * (instants, values, order, spelling, dialect: separator, decimal comma,
 * missing markers, local wall-clock timestamps), so the test knows the right answer:
 * the series the plan describes, or an InputError at the row of the one
 * broken cell, or the documented refusal (duplicate instant, fewer than 2
 * periods, a step that is not 15, 30 or 60 minutes).
 */

// dates around daylight-saving changes in the zones above, and ordinary ones
const START_DATES = [
  '2025-03-30', '2025-03-29', '2025-10-26', '2025-10-25', '2024-03-10', '2024-11-03', '2025-04-06', '2025-10-05',
  '2024-04-07', '2024-09-29', '2016-02-20', '2000-01-01', '1999-12-31', '2038-01-18', '2025-01-01',
];

const numberCell = fc.oneof(
  { weight: 6, arbitrary: fc.double({ min: -500, max: 3000, noNaN: true }).map((x) => String(Math.round(x * 100) / 100)) },
  { weight: 2, arbitrary: fc.integer({ min: -1000, max: 5000 }).map(String) },
  { weight: 1, arbitrary: fc.double({ min: -1e300, max: 1e300, noNaN: true }).map((x) => x.toExponential(3)) },
  { weight: 1, arbitrary: fc.constantFrom('0', '-0', '+7', '.5', '5.', '1e3', '-2.5E-3', ' 12 ', '0007.10') },
  { weight: 2, arbitrary: fc.constant('') },
);

// not a number in any dialect ('1,5' is one with the decimal comma, NA and NaN are missing markers)
const garbageNumber = fc.oneof(
  fc.constantFrom('Infinity', '-Infinity', 'inf', '12 34', 'abc', '1e999', '١٢', '0x1A', '—', '"', "'3", '1.2.3,4', 'N/A/'),
  fc.string({ unit: 'grapheme', minLength: 1, maxLength: 12 }).filter((t) => t.trim() !== '' && !/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(t.trim())),
);

// never a timestamp (wall-clock text without offset is one now: see the 'wall' style)
const garbageStamp = fc.constantFrom(
  '45658.5', 'yesterday', '', '2025-13-01T00:00Z', '2025-13-01 00:00', '2025-02-29 10:00', '2025-01-01 10:00:30',
  '2025-02-29T00:00Z', '2025-01-01T24:00Z', '2025-01-01T00:00+25:00', '30/03/2025 02:00', '2025-03-30T02:00:00 CET',
);

const RESERVED = ['__proto__', 'constructor', 'prototype'];
const DRIVER_NAMES = ['load_forecast', 'wind', 'Solar MW', 'temp (°C)', 'Gas "TTF"', 'x,y', 'Δ', 'constructor', 'price2'];

const plan = fc.record({
  zone: fc.constantFrom(...ZONES),
  resolution: fc.constantFrom(15, 30, 60),
  startDate: fc.oneof(fc.constantFrom(...START_DATES), fc.date({ min: new Date('1971-01-01'), max: new Date('2099-01-01'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10))),
  startSlot: fc.integer({ min: 0, max: 40 }),
  periods: fc.oneof({ weight: 1, arbitrary: fc.integer({ min: 0, max: 3 }) }, { weight: 6, arbitrary: fc.integer({ min: 4, max: 220 }) }),
  drivers: fc.uniqueArray(fc.constantFrom(...DRIVER_NAMES), { maxLength: 3 }),
  cells: fc.array(fc.tuple(numberCell, numberCell, numberCell, numberCell), { minLength: 220, maxLength: 220 }),
  drop: fc.array(fc.boolean(), { minLength: 220, maxLength: 220 }).map((a) => a.map((b, i) => b && i % 5 === 0)),
  stampStyle: fc.array(fc.constantFrom('local', 'Z', 'utc-offset', 'odd-offset', 'compact', 'space', 'millis', 'lower', 'wall', 'wall'), { minLength: 220, maxLength: 220 }),
  dialect: fc.constantFrom('plain', 'plain', 'semicolon', 'semicolon-comma', 'tab', 'tab-comma'),
  markers: fc.boolean(),
  order: fc.constantFrom('sorted', 'sorted', 'reversed', 'shuffled', 'swap'),
  shuffleKeys: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 230, maxLength: 230 }),
  duplicates: fc.array(fc.nat(), { maxLength: 2 }),
  garbage: fc.option(fc.record({ at: fc.nat(), column: fc.nat(), stamp: garbageStamp, number: garbageNumber, kind: fc.constantFrom('number', 'stamp', 'cells') }), { freq: 4 }),
  bom: fc.boolean(),
  crlf: fc.boolean(),
  blank: fc.array(fc.nat({ max: 230 }), { maxLength: 3 }),
  quoteAll: fc.boolean(),
  spaces: fc.boolean(),
  header: fc.constantFrom('timestamp,price', 'Timestamp,Price', ' TIMESTAMP , price ', 'price,timestamp'),
  trailingNewline: fc.boolean(),
  // one row dated far from the others (a typo in the year), in periods of the resolution
  farRow: fc.option(fc.oneof(fc.integer({ min: 1, max: 50_000 }), fc.integer({ min: 4_100_000, max: 80_000_000 })), { freq: 8 }),
});
type Plan = typeof plan extends fc.Arbitrary<infer T> ? T : never;

interface Row { time: number; cells: string[]; line: number; bad: boolean; badCell?: number }

function stampText(t: number, zone: string, style: string): string {
  const local = DateTime.fromMillis(t, { zone });
  switch (style) {
    case 'local': return local.toISO({ suppressMilliseconds: true })!;
    case 'Z': return new Date(t).toISOString().replace('.000Z', 'Z');
    case 'utc-offset': return DateTime.fromMillis(t, { zone: 'utc' }).toFormat("yyyy-MM-dd'T'HH:mm:ss'+00:00'");
    case 'odd-offset': return DateTime.fromMillis(t, { zone: 'UTC-7' }).toFormat("yyyy-MM-dd'T'HH:mm:ssZZ");
    case 'compact': return local.toFormat("yyyy-MM-dd'T'HH:mmZZZ");
    case 'space': return local.toFormat('yyyy-MM-dd HH:mm:ssZZ');
    case 'millis': return local.toISO()!;
    case 'wall': {
      // local wall-clock text, unless the autumn change repeats this wall time (the order rule is tested on its own)
      const wall = toWallClock(t, zone);
      if (wallClockToUtc(wall, zone, false) !== wallClockToUtc(wall, zone, true)) return local.toISO({ suppressMilliseconds: true })!;
      return local.toFormat(t % 7_200_000 === 0 ? 'yyyy-MM-dd HH:mm' : "yyyy-MM-dd'T'HH:mm");
    }
    default: return new Date(t).toISOString().toLowerCase();
  }
}

function quote(cell: string, always: boolean): string {
  return always || /[",;\t\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** The file text and what the engine should make of it. */
function render(p: Plan) {
  const step = p.resolution * 60_000;
  const t0 = DateTime.fromISO(p.startDate, { zone: p.zone }).startOf('day').toMillis() + p.startSlot * step;
  const header = p.header.split(',');
  const priceFirst = header[0].trim().toLowerCase() === 'price';
  const names = [...header, ...p.drivers];
  let rows: Omit<Row, 'line'>[] = [];
  for (let i = 0; i < p.periods; i++) {
    if (p.drop[i]) continue;
    const time = t0 + i * step;
    const values = p.cells[i].slice(0, 1 + p.drivers.length);
    const stamp = stampText(time, p.zone, p.stampStyle[i]);
    const [price, ...drivers] = values;
    rows.push({ time, cells: priceFirst ? [price, stamp, ...drivers] : [stamp, price, ...drivers], bad: false });
  }
  if (p.farRow !== null && rows.length) {
    const last = rows[rows.length - 1].time;
    const time = last + Math.min(p.farRow, Math.floor((Date.UTC(9999, 5, 1) - last) / step)) * step;
    rows.push({ time, cells: priceFirst ? ['1', stampText(time, p.zone, 'Z')] : [stampText(time, p.zone, 'Z'), '1'], bad: false });
    rows[rows.length - 1].cells.push(...p.drivers.map(() => ''));
  }
  for (const d of p.duplicates) if (rows.length) rows.push({ ...rows[d % rows.length], cells: [...rows[d % rows.length].cells] });
  if (p.order === 'reversed') rows.reverse();
  else if (p.order === 'shuffled') rows = rows.map((r, i) => ({ r, k: p.shuffleKeys[i] })).sort((a, b) => a.k - b.k).map((x) => x.r);
  else if (p.order === 'swap' && rows.length > 3) [rows[1], rows[2]] = [rows[2], rows[1]];

  let garbageKind: string | undefined;
  if (p.garbage && rows.length) {
    const r = rows[p.garbage.at % rows.length];
    const timeCol = priceFirst ? 1 : 0;
    garbageKind = p.garbage.kind;
    r.bad = true;
    if (p.garbage.kind === 'stamp') r.cells[timeCol] = p.garbage.stamp;
    else if (p.garbage.kind === 'number') {
      const numberCols = r.cells.map((_, c) => c).filter((c) => c !== timeCol);
      r.badCell = numberCols[p.garbage.column % numberCols.length];
      r.cells[r.badCell] = p.garbage.number;
    } else r.cells.push('1');
    // a row left with only empty cells is a blank line, which is skipped (table.ts); with markers its cells are not empty
    if (!p.markers && r.cells.every((c) => c.trim() === '')) { rows.splice(p.garbage.at % rows.length, 1); garbageKind = undefined; }
  }

  const eol = p.crlf ? '\r\n' : '\n';
  const sep = p.dialect.startsWith('semicolon') ? ';' : p.dialect.startsWith('tab') ? '\t' : ',';
  const comma = p.dialect.endsWith('-comma');
  const timeCol = priceFirst ? 1 : 0;
  let marked = 0;
  // a cell as the dialect writes it: decimal commas, a missing marker for an empty value
  const written = (cell: string, c: number, garbage: boolean) => {
    if (c === timeCol) return cell;
    if (cell.trim() === '' && p.markers) return MISSING_MARKERS[marked++ % MISSING_MARKERS.length];
    return comma && !garbage && PLAIN_NUMBER.test(cell.trim()) ? cell.replace('.', ',') : cell;
  };
  const lines = [names.map((n) => quote(n, p.quoteAll)).join(sep)];
  const placed: Row[] = [];
  // row numbers are file lines: line breaks inside quoted cells count too
  const breaks = (t: string) => t.split('\n').length - 1;
  let line = 1 + breaks(lines[0]);
  rows.forEach((r, i) => {
    if (p.blank.includes(i)) { lines.push(p.spaces ? ' ' : ''); line++; }
    const cells = r.cells.map((c, j) => written(c, j, j === r.badCell)).map((c) => quote(p.spaces ? ` ${c} ` : c, p.quoteAll));
    lines.push(cells.join(sep));
    line++;
    placed.push({ ...r, line });
    line += breaks(lines[lines.length - 1]);
  });
  const text = (p.bom ? '\uFEFF' : '') + lines.join(eol) + (p.trailingNewline ? eol : '');
  return { text, rows: placed, names, garbageKind, priceFirst, marked };
}

function mode(sorted: number[]): number {
  const counts = new Map<number, number>();
  for (let i = 1; i < sorted.length; i++) counts.set(sorted[i] - sorted[i - 1], (counts.get(sorted[i] - sorted[i - 1]) ?? 0) + 1);
  return [...counts].sort((a, b) => b[1] - a[1] || a[0] - b[0])[0][0];
}

/** The series the plan describes, built the plain way. */
function expectSeries(series: Series, rows: Row[], names: string[], priceFirst: boolean, step: number) {
  const sorted = rows.map((r) => r.time).sort((a, b) => a - b);
  const first = sorted[0], last = sorted[sorted.length - 1];
  expect(series.resolution * 60_000).toBe(step);
  expect(series.times.length).toBe((last - first) / step + 1);
  const wrong: string[] = [];
  for (let k = 0; k < series.times.length; k++) if (series.times[k] !== first + k * step) { wrong.push(`time ${k}`); break; }
  const drivers = names.slice(2);
  expect(Object.keys(series.drivers)).toEqual(drivers.map((n) => n.trim()));
  const seen = new Set<number>();
  const num = (c: string) => (c.trim() === '' ? NaN : Number(c));
  for (const r of rows) {
    const k = (r.time - first) / step;
    seen.add(k);
    const [price, ...rest] = priceFirst ? [r.cells[0], ...r.cells.slice(2)] : r.cells.slice(1);
    if (!Object.is(series.price[k], num(price))) wrong.push(`price ${k} is ${series.price[k]}, not ${price}`);
    drivers.forEach((d, j) => { if (!Object.is(series.drivers[d.trim()][k], num(rest[j]))) wrong.push(`${d} ${k}`); });
  }
  for (let k = 0; k < series.price.length; k++) if (!seen.has(k) && !Number.isNaN(series.price[k])) { wrong.push(`gap ${k} is ${series.price[k]}`); break; }
  expect(wrong.slice(0, 3)).toEqual([]);
  return seen;
}

describe('parseCsv + buildSeries on generated files', () => {
  it('give the planned series, or an InputError at the row of the broken cell', () => {
    fc.assert(fc.property(plan, (p) => {
      const { text, rows, names, garbageKind, priceFirst, marked } = render(p);
      const r = outcome(() => buildSeries(parseCsv(text, 'fuzz.csv'), { zone: p.zone }));
      const step = p.resolution * 60_000;
      const lowerNames = names.map((n) => n.trim().toLowerCase());
      if (new Set(lowerNames).size < lowerNames.length || names.some((n) => RESERVED.includes(n.trim()))) { expect(r.ok).toBe(false); return; }
      if (garbageKind) {
        expect(r.ok, 'a broken cell must be refused').toBe(false);
        if (!r.ok) {
          const bad = rows.find((x) => x.bad)!;
          expect(r.error.where.row, r.error.message).toBe(bad.line);
          expect(r.error.where.file).toBe('fuzz.csv');
        }
        return;
      }
      if (rows.length === 0) { expect(r.ok).toBe(false); return; }
      const times = rows.map((x) => x.time);
      const unique = [...new Set(times)].sort((a, b) => a - b);
      if (unique.length < times.length) {
        expect(r.ok).toBe(false);
        if (!r.ok) expect(r.error.message).toMatch(/appears twice/);
        return;
      }
      if (unique.length < 2) { expect(r.ok).toBe(false); return; }
      const m = mode(unique);
      if (![15, 30, 60].includes(m / 60_000) || unique.some((t) => (t - unique[0]) % m !== 0)) { expect(r.ok).toBe(false); return; }
      if ((unique[unique.length - 1] - unique[0]) / m + 1 > MAX_PERIODS) {
        expect(r.ok).toBe(false);
        if (!r.ok) expect(r.error.message).toMatch(/wrong year/);
        return;
      }
      expect(r.ok, r.ok ? '' : r.error.message).toBe(true);
      if (!r.ok) return;
      const { series, report } = r.value;
      expect(series.zone).toBe(p.zone);
      const seen = expectSeries(series, rows, names, priceFirst, m);
      expect(report.rows).toBe(rows.length);
      expect(report.markedUnknown).toBe(marked);
      expect(report.periods).toBe(series.times.length);
      expect(report.gaps.reduce((n, g) => n + g.periods, 0)).toBe(series.times.length - seen.size);
      let outOfOrder = 0;
      for (let i = 1; i < times.length; i++) if (times[i] < times[i - 1]) outOfOrder++;
      expect(report.outOfOrderRows).toBe(outOfOrder);
      let lastKnown = -1;
      series.price.forEach((v, k) => { if (!Number.isNaN(v)) lastKnown = k; });
      expect(report.missingPrices).toBe(series.price.slice(0, lastKnown + 1).filter(Number.isNaN).length);
    }), params(400, 11));
  });

  it('refuse random bytes, empty and header-only files with an InputError or read them', () => {
    const text = fc.oneof(
      fc.string({ unit: 'binary', maxLength: 200 }),
      fc.string({ unit: 'grapheme', maxLength: 200 }),
      fc.constantFrom('', '\uFEFF', '\r\n\r\n', ' ,\n,', 'timestamp,price', 'timestamp,price\r\n', 'timestamp,price\n\n\n', '"', '"timestamp,price\n1,2',
        'timestamp,price,\n2025-01-01T00:00Z,1,\n2025-01-01T01:00Z,2,', 'timestamp,timestamp,price\n', ',,\n1,2,3', 'timestamp;price\n2025-01-01T00:00Z;1'),
      fc.array(fc.constantFrom('timestamp', 'price', ',', '\n', '\r\n', '"', '2025-01-01T00:00Z', '2025-01-01T01:00Z', '12.5', ' ', 'NaN', '\uFEFF'), { maxLength: 40 }).map((a) => a.join('')),
    );
    fc.assert(fc.property(text, fc.constantFrom(...ZONES), (t, zone) => {
      const r = outcome(() => buildSeries(parseCsv(t, 'x.csv'), { zone }));
      if (r.ok) {
        const { series } = r.value;
        expect(series.times.length).toBeGreaterThanOrEqual(2);
        for (const v of [...series.price, ...Object.values(series.drivers).flat()]) expect(Number.isNaN(v) || Number.isFinite(v)).toBe(true);
      }
    }), params(1500, 12));
  });

  it('refuse a bad zone, a target column that is not there and a reserved column name', () => {
    const base = 'timestamp,price,wind\n2025-01-01T00:00Z,1,2\n2025-01-01T01:00Z,2,3\n';
    fc.assert(fc.property(fc.string({ maxLength: 30 }), (zone) => {
      const r = outcome(() => buildSeries(parseCsv(base, 'z.csv'), { zone }));
      if (r.ok) expect(DateTime.local().setZone(zone).isValid).toBe(true);
    }), params(300, 14));
    expect(() => buildSeries(parseCsv(base, 'z.csv'), { zone: 'UTC', target: 'actual' })).toThrow(InputError);
    // a column named __proto__ would set the prototype of the drivers: refused
    expect(() => buildSeries(parseCsv(base.replace('wind', '__proto__'), 'p.csv'), { zone: 'UTC' })).toThrow(/reserved/);
  });
});

describe('parseCsv + buildSeries on one file of 10^6 rows', () => {
  it('reads 10^6 quarter-hours (2000-2028, Europe/Berlin) with CRLF, a gap and unknown prices (its speed: npm run bench, bench/engine-speed.ts)', () => {
    const step = 900_000;
    const t0 = Date.parse('1999-12-31T23:00:00Z');
    const n = 1_000_000;
    const parts: string[] = ['timestamp,price,load_forecast'];
    for (let k = 0; k < n; k++) {
      if (k >= 500_000 && k < 500_010) continue; // a gap of 10 periods
      const t = new Date(t0 + k * step).toISOString();
      const price = k % 1000 === 7 ? '' : ((k * 7919) % 20011 / 100 - 50).toFixed(2);
      parts.push(`${t},${price},${k % 977}`);
    }
    const text = parts.join('\r\n');
    const { series, report } = buildSeries(parseCsv(text, 'big.csv'), { zone: 'Europe/Berlin' });
    expect(series.times.length).toBe(n);
    expect(series.resolution).toBe(15);
    expect(report.gaps).toEqual([{ from: t0 + 500_000 * step, periods: 10 }]);
    for (const k of [0, 1, 7, 123_456, 499_999, 500_005, 500_010, n - 1]) {
      const gap = k >= 500_000 && k < 500_010;
      expect(series.price[k]).toBe(gap || k % 1000 === 7 ? NaN : Number(((k * 7919) % 20011 / 100 - 50).toFixed(2)));
      expect(series.drivers.load_forecast[k]).toBe(gap ? NaN : k % 977);
    }
    const days = deliveryDays(series);
    // 2000-01-01 .. 2028-07-11 local: 10419 days, the last one cut short
    expect(days[0].date).toBe('2000-01-01');
    expect(days.reduce((s, d) => s + d.count, 0)).toBe(n);
    expect(days.filter((d) => d.expected === 92).length).toBe(days.filter((d) => d.date.slice(5, 7) === '03' && d.expected !== 96).length);
  }, 90_000);
});
