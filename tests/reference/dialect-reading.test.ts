import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildSeries, describeDialect, parseCsv } from '../../src/engine';

// Reference: pandas 1.5.3 read_csv(sep=';', decimal=',', thousands='.') and
// tz_localize('Europe/Berlin', ambiguous='infer') on the same file, computed once
// (tests/reference/fixtures/README-dialect-fixtures.md has the script).
const FIXTURES = join(__dirname, 'fixtures');
const text = readFileSync(join(FIXTURES, 'continental-export.csv'), 'utf8');
const pandas = JSON.parse(readFileSync(join(FIXTURES, 'continental-pandas.json'), 'utf8')) as {
  times: number[]; price: (number | null)[]; load_forecast: (number | null)[]; wind_forecast: (number | null)[];
};
const values = (xs: (number | null)[]) => xs.map((x) => (x === null ? NaN : x));

describe('a continental desk export (;, decimal comma, thousands, markers, local time over the 25-hour day) read as pandas reads it', () => {
  const table = parseCsv(text, 'continental-export.csv');
  const { series, report } = buildSeries(table, { zone: 'Europe/Berlin' });

  it('detects the dialect: ;-separated with decimal commas', () => {
    expect(table.dialect).toEqual({ delimiter: ';', decimal: ',' });
    expect(describeDialect(table.dialect!)).toBe("read as ';'-separated with decimal commas");
  });

  it('gives the instants pandas gives, the repeated 02:00 in row order (tz_localize ambiguous="infer")', () => {
    expect(series.times).toEqual(pandas.times);
    // 2025-10-26: 02:00 CEST is 00:00 UTC, 02:00 CET is 01:00 UTC (Directive 2000/84/EC: the change is at 01:00 UTC)
    expect(series.times[4]).toBe(Date.UTC(2025, 9, 26, 0));
    expect(series.times[5]).toBe(Date.UTC(2025, 9, 26, 1));
  });

  it('gives the numbers pandas gives, bit for bit, markers as unknown', () => {
    expect(series.price).toEqual(values(pandas.price));
    expect(series.drivers.load_forecast).toEqual(values(pandas.load_forecast));
    expect(series.drivers.wind_forecast).toEqual(values(pandas.wind_forecast));
    // the file's marker cells (not the empty one) are counted for the report
    const markers = text.split(/\r?\n/).slice(1).flatMap((l) => l.split(';').slice(1)).filter((c) => /^(NA|N\/A|n\/a|#N\/A|-|null|NaN|#NV)$/.test(c));
    expect(markers.length).toBeGreaterThan(5);
    expect(report.markedUnknown).toBe(markers.length);
  });
});
