import { describe, expect, it } from 'vitest';
import { csvSheet, sheetNameFor } from '../../src/preview/csv-sheet';

describe('csvSheet(text, fileName, taken)', () => {
  it('reads the data file: numbers as numbers (. decimal), timestamps as text, empty fields as empty cells', () => {
    const sheet = csvSheet('\ufefftimestamp,price,load_forecast\n2026-11-29T23:00:00+01:00,41.5,6010\n2026-11-30T00:00:00+01:00,,5990\n', 'prices.csv', []);
    expect(sheet.name).toBe('prices');
    expect(sheet.grid).toEqual([
      ['timestamp', 'price', 'load_forecast'],
      ['2026-11-29T23:00:00+01:00', 41.5, 6010],
      ['2026-11-30T00:00:00+01:00', null, 5990],
    ]);
    expect(sheet.ranges).toEqual({ times: 'prices!A1:A3', prices: 'prices!B1:B3', drivers: ['prices!C1:C3'] });
    expect(sheet.notes).toEqual(['2 data rows, 3 columns']);
  });

  it('finds timestamp and price by name and groups the other columns into ranges of neighbours', () => {
    const sheet = csvSheet('wind,price,x,timestamp,load\n1,2,3,2026-01-01T00:00Z,5\n', 'my data.csv', ['My Data']);
    expect(sheet.name).toBe('my data 2');
    expect(sheet.ranges).toEqual({ times: "'my data 2'!D1:D2", prices: "'my data 2'!B1:B2", drivers: ["'my data 2'!A1:A2", "'my data 2'!C1:C2", "'my data 2'!E1:E2"] });
  });

  it('keeps a field that begins with = as text, so a file never puts a formula into the workbook', () => {
    const sheet = csvSheet('timestamp,price\n2026-01-01T00:00Z,"=LOOM.HOLIDAY(""2026-10-03"", ""DE"")"\n', 'x.csv', []);
    expect(sheet.grid[1][1]).toBe('\'=LOOM.HOLIDAY("2026-10-03", "DE")');
    expect(sheet.notes).toContain("1 field beginning with = kept as text (shown with a leading ')");
  });

  it('without a header row takes the first column as timestamps and the second as prices', () => {
    const sheet = csvSheet('2026-01-01T00:00Z,1\n2026-01-01T01:00Z,2\n', 'raw.txt', []);
    expect(sheet.ranges).toEqual({ times: 'raw!A1:A2', prices: 'raw!B1:B2', drivers: [] });
    expect(sheet.notes[1]).toMatch(/no header row found/);
  });

  it('refuses an empty file and a line it cannot read, naming the file', () => {
    expect(() => csvSheet(' \n', 'empty.csv', [])).toThrow(/^empty.csv is empty/);
    expect(() => csvSheet('timestamp,price\n"2026-01-01,1\n', 'bad.csv', [])).toThrow('bad.csv: row 2: a quoted cell is not closed: a " opens it and no " ends it');
    expect(() => csvSheet('timestamp,price\n2026-01-01T00:00Z,1,2\n', 'ragged.csv', [])).toThrow(/^ragged\.csv: row 2: has 3 cells but the header has 2 columns/);
  });

  it('reads a file in the dialects desks export with the command line\'s reader: ;, decimal commas, thousands, missing markers', () => {
    const sheet = csvSheet('\ufefftimestamp;price;load_forecast\r\n2026-11-29 23:00;41,5;6.010\r\n2026-11-30 00:00;NA;5.990,5\r\n2026-11-30 01:00;-3,25;#N/A\r\n', 'export.csv', []);
    expect(sheet.grid).toEqual([
      ['timestamp', 'price', 'load_forecast'],
      ['2026-11-29 23:00', 41.5, 6010],
      ['2026-11-30 00:00', null, 5990.5],
      ['2026-11-30 01:00', -3.25, null],
    ]);
    expect(sheet.notes).toEqual(['3 data rows, 3 columns', "read as ';'-separated with decimal commas", '2 cells with a missing marker (NA, #N/A, -, …) left empty']);
    expect(csvSheet('timestamp\tprice\n2026-01-01T00:00Z\t12.5\n', 'tab.tsv', []).grid[1]).toEqual(['2026-01-01T00:00Z', 12.5]);
  });

  it('refuses numbers it cannot read one way only, as the command line does', () => {
    expect(() => csvSheet('timestamp;price\n2026-01-01 00:00;1.234\n', 'amb.csv', [])).toThrow(/amb\.csv: row 2, column "price": "1\.234" could be 1\.234 with a decimal point or 1234/);
  });
});

describe('sheetNameFor(fileName, taken)', () => {
  it('makes a sheet name from a file name: no : \\ / ? * [ ], at most 31 characters, not taken', () => {
    expect(sheetNameFor('C:\\data\\prices[de]*.csv', [])).toBe('prices_de__');
    expect(sheetNameFor(`${'x'.repeat(40)}.csv`, [])).toHaveLength(31);
    expect(sheetNameFor(`${'x'.repeat(40)}.csv`, ['x'.repeat(31)])).toBe(`${'x'.repeat(29)} 2`);
    expect(sheetNameFor('.csv', [])).toBe('Imported');
  });
});
