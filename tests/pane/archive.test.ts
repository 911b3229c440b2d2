import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import type { CellValue } from '../../src/host/workbook-port';
import {
  ARCHIVE_HEADER, ARCHIVE_SHEET, appendToArchive, archiveRows, findLastUsedRow, lastUsedRow, modelVersion, parseArchive, readArchive, type Issue,
} from '../../src/pane/logic/archive';

const ZONE = 'Europe/Berlin';
const day = (date: string, base: number) => Array.from({ length: 24 }, (_, i) => ({
  time: Date.parse(`${date}T00:00:00+02:00`) + i * 3_600_000, forecast: base + i, lower: base + i - 5, upper: base + i + 5,
}));
const issue = (at: string, model = 'main'): Issue => ({ issuedAt: Date.parse(at), model, created: '2025-06-01T08:00:00.000Z', version: '1-0000abcd', zone: ZONE });
const snapshot = (port: MemoryWorkbook) => port.usedGrid(ARCHIVE_SHEET).map((r) => [...r]);

describe('modelVersion(formatVersion, text)', () => {
  it('gives the FNV-1a fingerprint of the text with the format version', () => {
    // FNV-1a 32-bit of "a" is 0xe40c292c (FNV test vectors, draft-eastlake-fnv; from memory)
    expect(modelVersion(1, 'a')).toBe('1-e40c292c');
    expect(modelVersion(1, '')).toBe('1-811c9dc5');
    expect(modelVersion(1, '{"w":1}')).not.toBe(modelVersion(1, '{"w":2}'));
  });
});

describe('archiveRows(issue, rows)', () => {
  it('writes issue time, model, created, version, delivery start, forecast, lower, upper per period', () => {
    const [first] = archiveRows(issue('2025-06-01T09:15:00Z'), day('2025-06-02', 40));
    expect(first).toEqual(['2025-06-01T11:15:00+02:00', 'main', '2025-06-01T08:00:00.000Z', '1-0000abcd', '2025-06-02T00:00:00+02:00', 40, 35, 45]);
  });
});

describe('lastUsedRow(values)', () => {
  it('finds the last row with any non-empty cell', () => {
    expect(lastUsedRow([[null], ['x'], [''], [null]])).toBe(1);
    expect(lastUsedRow([[null, ''], []])).toBe(-1);
  });
});

describe('appendToArchive(port, issue, rows)', () => {
  it('adds the sheet with a header on first use', async () => {
    const port = new MemoryWorkbook();
    const address = await appendToArchive(port, issue('2025-06-01T09:00:00Z'), day('2025-06-02', 40));
    expect(address).toBe("'Forecast archive'!A1:H25");
    expect(await port.listSheets()).toContain(ARCHIVE_SHEET);
    expect(snapshot(port)[0]).toEqual(ARCHIVE_HEADER);
    expect(snapshot(port).length).toBe(25);
    // prices with two decimals; the header and the exact times as text stay General
    expect(await port.readFormats("'Forecast archive'!A1:H2")).toEqual([
      [null, null, null, null, null, null, null, null],
      [null, null, null, null, null, '0.00', '0.00', '0.00'],
    ]);
  });

  it('appends below the last used row and never changes a row that was there', async () => {
    const port = new MemoryWorkbook();
    await appendToArchive(port, issue('2025-06-01T09:00:00Z'), day('2025-06-02', 40));
    // a colleague's note in the archive, below the rows and in a column of its own
    await port.writeRange("'Forecast archive'!C27", [['checked by desk']]);
    const before = snapshot(port);
    const address = await appendToArchive(port, issue('2025-06-02T09:00:00Z'), day('2025-06-03', 60));
    expect(address).toBe("'Forecast archive'!A28:H51");
    const after = snapshot(port);
    expect(after.slice(0, before.length).map((r) => r.slice(0, before[0].length))).toEqual(before);
    expect(after[27][1]).toBe('main');
    expect(after[27][5]).toBe(60);
    expect(after.length).toBe(51);
  });

  it('finds the last row past the first block of rows it reads', async () => {
    const grid: CellValue[][] = [ARCHIVE_HEADER.slice()];
    for (let i = 1; i < 2500; i++) grid.push(['2025-06-01T11:00:00+02:00', 'old', '', '', '2025-06-02T00:00:00+02:00', i, '', '']);
    const port = new MemoryWorkbook({ sheets: { [ARCHIVE_SHEET]: grid } });
    expect(await findLastUsedRow(port, ARCHIVE_SHEET)).toBe(2499);
    expect(await appendToArchive(port, issue('2025-06-02T09:00:00Z'), day('2025-06-03', 1))).toBe("'Forecast archive'!A2501:H2524");
  });

  it('refuses an empty forecast without touching the workbook', async () => {
    const port = new MemoryWorkbook();
    await expect(appendToArchive(port, issue('2025-06-01T09:00:00Z'), [])).rejects.toThrow(/no forecast to archive/);
    expect(await port.listSheets()).not.toContain(ARCHIVE_SHEET);
  });
});

describe('parseArchive(values) and readArchive(port)', () => {
  it('reads back exactly what was appended', async () => {
    const port = new MemoryWorkbook();
    const rows = day('2025-06-02', 40);
    await appendToArchive(port, issue('2025-06-01T09:00:00Z'), rows);
    const entries = await readArchive(port);
    expect(entries.length).toBe(24);
    expect(entries[0]).toEqual({ row: 2, issuedAt: Date.parse('2025-06-01T09:00:00Z'), model: 'main', created: '2025-06-01T08:00:00.000Z', version: '1-0000abcd', time: rows[0].time, forecast: 40, lower: 35, upper: 45 });
  });

  it('names the row and column of a cell that does not parse', () => {
    expect(() => parseArchive([ARCHIVE_HEADER, ['2025-06-01T11:00:00+02:00', 'm', '', '', '2025-06-02T00:00:00+02:00', 'abc', '', '']]))
      .toThrow('Forecast archive: row 2, column "forecast": "abc" is not a number');
  });

  it('gives no entries when the sheet is missing', async () => {
    expect(await readArchive(new MemoryWorkbook())).toEqual([]);
  });
});
