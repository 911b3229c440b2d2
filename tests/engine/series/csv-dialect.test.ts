import { describe, expect, it } from 'vitest';
import { describeDialect, detectDecimal, detectDelimiter, parseCsv, parseDecimalMark, parseDelimiter } from '../../../src/engine';

const rows = (...cells: string[][]) => ({ rows: cells, numbers: cells.map((_, i) => i + 2) });

describe('detectDelimiter(text)', () => {
  it('finds , ; and tab from the header and first rows', () => {
    expect(detectDelimiter('timestamp,price\n2025-01-01T00:00Z,41.2\n')).toBe(',');
    expect(detectDelimiter('timestamp;price;load\n2025-01-01T00:00Z;41,2;6.012\n')).toBe(';');
    expect(detectDelimiter('timestamp\tprice\n2025-01-01T00:00Z\t41,2\n')).toBe('\t');
  });

  it('is not fooled by one decimal comma in every row of a ;-file (the comma splits the header into one column)', () => {
    expect(detectDelimiter('timestamp;price\n2025-01-01 00:00;41,2\n2025-01-01 01:00;40,9\n')).toBe(';');
  });

  it('prefers the separator that splits every row like the header, then the one with more columns', () => {
    // the header names a column "gas; TTF" in quotes (RFC 4180 §2 rule 6): the ; inside does not split it
    expect(detectDelimiter('timestamp,price,"gas; TTF"\n2025-01-01T00:00Z,41.2,30\n')).toBe(',');
    expect(detectDelimiter('timestamp;price;x,y\n2025-01-01T00:00Z;1,5;3\n2025-01-01T01:00Z;2;3\n')).toBe(';');
  });

  it('passes over a separator that leaves a quote unbalanced (a tab file with a quoted "x,y" column and a quoted "5," cell, found by tests/fuzz/csv-ingest)', () => {
    expect(detectDelimiter('timestamp\tprice\t"x,y"\tload\n2025-03-30T00:15:00+01:00\t\t\t"5,"\t1\n2025-03-30T00:30:00+01:00\t0\t0\t0\n')).toBe('\t');
  });

  it('falls back to , when nothing splits the header', () => {
    expect(detectDelimiter('timestamp|price\n1|2\n')).toBe(',');
    expect(detectDelimiter('')).toBe(',');
  });
});

describe('detectDecimal(rows, rowNumbers, header, source)', () => {
  const header = ['timestamp', 'price', 'load'];
  const detect = (r: ReturnType<typeof rows>) => detectDecimal(r.rows, r.numbers, header, 'f.csv');

  it('reads the decimal comma from 41,25 or 1.234,5 and the point from 41.25', () => {
    expect(detect(rows(['2025-01-01 00:00', '41,25', '6012']))).toBe(',');
    expect(detect(rows(['2025-01-01 00:00', '41', '6.012,5']))).toBe(',');
    expect(detect(rows(['2025-01-01 00:00', '41.25', '6012']))).toBe('.');
    expect(detect(rows(['2025-01-01 00:00', '41', '6012']))).toBe('.');
    // 1.234.567 can only group thousands, so its decimal mark is the comma
    expect(detect(rows(['2025-01-01 00:00', '1.234.567', '1']))).toBe(',');
  });

  it('lets a clear number settle 1.234 elsewhere in the file', () => {
    expect(detect(rows(['t', '6.012', '1'], ['t', '41,5', '1']))).toBe(',');
    expect(detect(rows(['t', '1.234', '1'], ['t', '41.55', '1']))).toBe('.');
  });

  it('takes no evidence from a cell that is a number in neither notation (it is refused later, at its own row)', () => {
    expect(detect(rows(['t', '41.5', '1'], ['t', '1.2.3,4', '1']))).toBe('.');
  });

  it('skips timestamps and missing markers', () => {
    expect(detect(rows(['2025-01-01T00:00:00.000+01:00', 'NA', '-'], ['2025-01-01 01:00', '#N/A', '12,5']))).toBe(',');
  });

  it('refuses numbers whose only evidence is 1.234 or 1,234, naming the cell and the choice', () => {
    expect(() => detect(rows(['t', '1.234', '7']))).toThrow(
      'f.csv: row 2, column "price": "1.234" could be 1.234 with a decimal point or 1234 with "." grouping thousands, and no other number in the file tells which; say which is meant (spotloom: --decimal . or --decimal ,)',
    );
    expect(() => detect(rows(['t', '7', '1,234']))).toThrow(/row 2, column "load": "1,234" could be 1\.234 with a decimal comma or 1234 with "," grouping thousands/);
  });

  it('refuses a file that mixes decimal commas and points, naming both cells', () => {
    expect(() => detect(rows(['t', '41,25', '1'], ['t', '41.25', '1']))).toThrow(
      'f.csv: the numbers mix decimal commas ("41,25" in row 2, column "price") and decimal points ("41.25" in row 3, column "price"); write them one way, or say which is meant (spotloom: --decimal , or --decimal .)',
    );
  });
});

describe('parseCsv(text, source, choice) in the dialects desks export', () => {
  it('reads a ; file with decimal commas, a tab file, and keeps cell texts as written', () => {
    expect(parseCsv('\ufefftimestamp;price\r\n2025-01-01 00:00;41,25\r\n', 'a.csv')).toMatchObject({
      header: ['timestamp', 'price'], rows: [['2025-01-01 00:00', '41,25']], dialect: { delimiter: ';', decimal: ',' },
    });
    expect(parseCsv('timestamp\tprice\n2025-01-01T00:00Z\t41.25\n', 'b.tsv').dialect).toEqual({ delimiter: '\t', decimal: '.' });
  });

  it('takes the separator and decimal mark the user gives instead of detecting them', () => {
    expect(parseCsv('timestamp;price\n2025-01-01 00:00;1.234\n', 'c.csv', { decimal: ',' }).dialect).toEqual({ delimiter: ';', decimal: ',' });
    expect(parseCsv('a;b,c\n1;2,3\n', 'd.csv', { delimiter: ',' }).header).toEqual(['a;b', 'c']);
  });

  it('refuses a decimal comma with the comma as separator', () => {
    expect(() => parseCsv('a,b\n1,2\n', 'e.csv', { delimiter: ',', decimal: ',' })).toThrow('e.csv: a decimal comma needs ; or tab as the separator');
  });

  it('no longer reads a ;-file as one column (it failed with "has 6 cells but the header has 1")', () => {
    const t = parseCsv('timestamp;price;t;l;w;s\n2025-01-01 00:00;41,2;3,5;6012;1,1;0\n', 'f.csv');
    expect(t.header).toHaveLength(6);
    expect(t.rows[0]).toHaveLength(6);
  });
});

describe('describeDialect, parseDelimiter, parseDecimalMark', () => {
  it('says nothing for the plain dialect and names the others', () => {
    expect(describeDialect({ delimiter: ',', decimal: '.' })).toBeUndefined();
    expect(describeDialect({ delimiter: ';', decimal: ',' })).toBe("read as ';'-separated with decimal commas");
    expect(describeDialect({ delimiter: '\t', decimal: '.' })).toBe('read as tab-separated');
    expect(describeDialect({ delimiter: ';', decimal: '.' })).toBe("read as ';'-separated");
  });

  it('reads the flags as a user types them', () => {
    expect(parseDelimiter(';')).toBe(';');
    expect(parseDelimiter('tab')).toBe('\t');
    expect(parseDelimiter('TAB')).toBe('\t');
    expect(parseDelimiter('\\t')).toBe('\t');
    expect(() => parseDelimiter('|')).toThrow('"|" is not a separator Spotloom reads; give , or ; or tab');
    expect(parseDecimalMark(',')).toBe(',');
    expect(() => parseDecimalMark('x')).toThrow(/not a decimal mark/);
  });
});
