import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { toCsv } from '../../../src/engine/demo/to-csv';
import type { DemoRow } from '../../../src/engine/demo/generate-market';

const rows: DemoRow[] = [
  { timestamp: '2025-10-26T02:00:00+02:00', price: 41.256, temperature_forecast: 7.26, load_forecast: 5123.6 },
  { timestamp: '2025-10-26T02:00:00+01:00', price: -0.001, temperature_forecast: -0.04, load_forecast: 4990 },
  { timestamp: '2025-10-26T03:00:00+01:00', price: NaN, temperature_forecast: 6.9, load_forecast: 4987.4 },
];

describe('toCsv(rows)', () => {
  it('writes the header and the documented decimals: price 2, temperature 1, load 0', () => {
    const lines = toCsv(rows).split('\n');
    expect(lines[0]).toBe('timestamp,price,temperature_forecast,load_forecast');
    expect(lines[1]).toBe('2025-10-26T02:00:00+02:00,41.26,7.3,5124');
    expect(lines[2]).toBe('2025-10-26T02:00:00+01:00,0.00,0.0,4990'); // no "-0.00"
  });

  it('writes an unknown value (NaN) as an empty cell and ends with a newline', () => {
    const text = toCsv(rows);
    expect(text.split('\n')[3]).toBe('2025-10-26T03:00:00+01:00,,6.9,4987');
    expect(text.endsWith('\n')).toBe(true);
    expect(text.split('\n')).toHaveLength(rows.length + 2);
  });

  it('adds extra driver columns in the rows\' key order, whole MW', () => {
    const solar: DemoRow[] = [
      { timestamp: '2025-12-01T12:00:00+10:30', price: -12.5, temperature_forecast: 24, load_forecast: 1500, solar_forecast: 1234.5 },
    ];
    expect(toCsv(solar)).toBe(
      'timestamp,price,temperature_forecast,load_forecast,solar_forecast\n2025-12-01T12:00:00+10:30,-12.50,24.0,1500,1235\n',
    );
  });

  it('reads back with papaparse (general-purpose CSV library) to the rounded values', () => {
    const parsed = Papa.parse<Record<string, string>>(toCsv(rows).trim(), { header: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => r.price)).toEqual(['41.26', '0.00', '']);
    expect(parsed.data.map((r) => r.timestamp)).toEqual(rows.map((r) => r.timestamp));
  });

  it('gives just a header for no rows', () => {
    expect(toCsv([])).toBe('timestamp,price\n');
  });
});
