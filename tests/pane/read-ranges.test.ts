import { describe, expect, it } from 'vitest';
import { formatTimestamp } from '../../src/engine';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { checkData, driverName, isHeaderCell, splitAddresses, tableFromRanges } from '../../src/pane/logic/read-ranges';
import { historySheet } from './support';

const OPTS = { zone: 'Europe/Berlin', dateSystem: '1900' as const };

describe('splitAddresses(text)', () => {
  it('splits on commas and semicolons but not inside a quoted sheet name', () => {
    expect(splitAddresses("Drivers!B2:C90; 'Load, wind'!D2:D90 ,, ")).toEqual(['Drivers!B2:C90', "'Load, wind'!D2:D90"]);
  });
});

describe('driverName(header, fallback)', () => {
  it('keeps allowed characters and replaces the rest', () => {
    expect(driverName('Temperature (°C)', 'driver_C')).toBe('Temperature _C_');
    expect(driverName('  ', 'driver_C')).toBe('driver_C');
    expect(driverName('Price', 'driver_C')).toBe('Price_driver');
  });
});

describe('isHeaderCell(value, kind)', () => {
  it('treats words as headers and numbers, blanks and ISO text as data', () => {
    expect(isHeaderCell('timestamp', 'times')).toBe(true);
    expect(isHeaderCell('2025-01-01T00:00Z', 'times')).toBe(false);
    expect(isHeaderCell(45658, 'times')).toBe(false);
    expect(isHeaderCell('12.5', 'values')).toBe(false);
    expect(isHeaderCell(null, 'values')).toBe(false);
  });
});

describe('tableFromRanges(ranges, options)', () => {
  const times = (cells: unknown[]) => ({ address: 'History!A1:A' + cells.length, values: cells.map((c) => [c]) as never });
  const prices = (cells: unknown[]) => ({ address: 'History!B1:B' + cells.length, values: cells.map((c) => [c]) as never });

  it('turns serials and ISO text into UTC ISO timestamps, skips header rows and trailing blank rows', () => {
    const { table, layout } = tableFromRanges({
      times: times(['timestamp', 45658, '2025-01-01T01:00:00+01:00', null, null]),
      prices: prices(['price', 41.5, '-3', null, '']),
      drivers: [{ address: 'History!C1:D5', values: [['load', 'wind'], [1, 2], [3, 4], [null, null], [null, null]] }],
    }, OPTS);
    expect(table.header).toEqual(['timestamp', 'price', 'load', 'wind']);
    expect(table.rows).toEqual([
      ['2024-12-31T23:00:00.000Z', '41.5', '1', '2'],
      ['2025-01-01T00:00:00.000Z', '-3', '3', '4'],
    ]);
    expect(table.rowNumbers).toEqual([2, 3]);
    expect(layout).toEqual({ times: 'History!A2:A3', prices: 'History!B2:B3', drivers: ['History!C2:D3'], driverNames: ['load', 'wind'], rows: 2 });
  });

  it('names driver columns after their sheet column when there is no header', () => {
    const { table } = tableFromRanges({
      times: times([45658, 45658 + 1 / 24]), prices: prices([1, 2]),
      drivers: [{ address: 'History!F1:F2', values: [[5], [6]] }],
    }, OPTS);
    expect(table.header).toEqual(['timestamp', 'price', 'driver_F']);
  });

  it('refuses a row that has values but no timestamp, naming its sheet row', () => {
    expect(() => tableFromRanges({ times: times(['timestamp', 45658, null, 45658.5]), prices: prices(['price', 1, 2, 3]), drivers: [] }, OPTS))
      .toThrow('History: row 3, column "timestamp": has values but no timestamp; fill in the timestamp or clear the row');
  });

  it('refuses ranges with different numbers of data rows', () => {
    expect(() => tableFromRanges({ times: times([45658, 45658.5, 45659]), prices: prices([1, 2]), drivers: [] }, OPTS))
      .toThrow(/different numbers of data rows \(timestamps 3, prices 2\)/);
  });

  it('refuses a timestamp range wider than one column', () => {
    expect(() => tableFromRanges({ times: { address: 'History!A1:B2', values: [[1, 2], [3, 4]] }, prices: prices([1, 2]), drivers: [] }, OPTS))
      .toThrow(/must be one column wide/);
  });
});

describe('checkData(port, choice, zone)', () => {
  it('reads the ranges through the port and reports resolution, days, the autumn DST day and open rows', async () => {
    // 2025-10-20 .. 2025-11-02 local: includes 2025-10-26, a 25-hour day in Berlin (Directive 2000/84/EC)
    const grid = historySheet(14, { startUtc: '2025-10-19T22:00:00Z', openDays: 1 });
    const port = new MemoryWorkbook({ sheets: { History: grid } });
    const n = grid.length;
    const data = await checkData(port, { times: `History!A1:A${n + 20}`, prices: `History!B1:B${n + 20}`, drivers: [`History!C1:C${n + 20}`] }, 'Europe/Berlin');
    expect(data.series.resolution).toBe(60);
    expect(data.series.times.length).toBe(14 * 24 + 1); // 13 days of 24 hours and one of 25
    expect(Object.keys(data.series.drivers)).toEqual(['load forecast']);
    expect(data.lines[0]).toMatch(/^337 periods of 60 minutes in 14 delivery days, 2025-10-20 to 2025-11-02 \(Europe\/Berlin\)$/);
    expect(data.lines.join('\n')).toMatch(/daylight-saving days: 2025-10-26 \(25\)/);
    // both 02:00 rows of 2025-10-26 became distinct instants, an hour apart
    const twoAm = data.series.times.filter((t) => formatTimestamp(t, 'Europe/Berlin').startsWith('2025-10-26T02:00'));
    expect(twoAm.length).toBe(2);
    expect(data.firstOpenRow).toBe(n - 24 + 1);
    expect(data.layout.times).toBe(`History!A2:A${n}`);
  });

  it('says in one line which cell is wrong', async () => {
    const grid = historySheet(3);
    grid[5][1] = 'n/a';
    const port = new MemoryWorkbook({ sheets: { History: grid } });
    const error = await checkData(port, { times: 'History!A1:A73', prices: 'History!B1:B73', drivers: [] }, 'Europe/Berlin').catch((e) => e);
    expect(error.message).toBe('History: row 6, column "price": "n/a" is not a number (use . as decimal separator)');
    expect(error.message).not.toContain('\n');
  });

  it('asks for the ranges before reading anything', async () => {
    const port = new MemoryWorkbook();
    await expect(checkData(port, { times: '', prices: '', drivers: [] }, 'Europe/Berlin')).rejects.toThrow(/pick the timestamp range first/);
  });
});
