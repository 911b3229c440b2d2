import { describe, expect, it } from 'vitest';
import { InputError, parseCsv } from '../../../src/engine';

describe('parseCsv(text, source)', () => {
  it('reads a header and rows of cell texts', () => {
    expect(parseCsv('timestamp,price\n2025-01-01T00:00Z,41.2\n', 'a.csv')).toEqual({
      source: 'a.csv', header: ['timestamp', 'price'], rows: [['2025-01-01T00:00Z', '41.2']], rowNumbers: [2],
      dialect: { delimiter: ',', decimal: '.' },
    });
  });

  it('follows RFC 4180 quoting: commas, doubled quotes and CRLF line ends', () => {
    // RFC 4180 §2 rules 5-7: fields in double quotes may hold commas, line breaks and "" for a quote
    const t = parseCsv('name,note\r\n"a,b","say ""hi"""\r\nc,\r\n', 'q.csv');
    expect(t.rows).toEqual([['a,b', 'say "hi"'], ['c', '']]);
    expect(t.rowNumbers).toEqual([2, 3]);
  });

  it('keeps a quoted line break inside its cell', () => {
    expect(parseCsv('a,b\n"x\ny",1\n', 'q.csv').rows).toEqual([['x\ny', '1']]);
  });

  // a quoted cell with a line break spans two lines: later rows keep their file line numbers
  it('numbers rows by their line after a quoted line break', () => {
    expect(parseCsv('a,b\n"x\ny",1\n3,4\n', 'q.csv').rowNumbers).toEqual([2, 4]);
    expect(() => parseCsv('a,b\n"x\ny",1\n3\n', 'q.csv')).toThrow('q.csv: row 4: has 1 cell but the header has 2 columns');
  });

  it('skips blank lines but keeps their place in the row numbering', () => {
    const t = parseCsv('\n\na,b\n1,2\n\n  , \n3,4\n', 'b.csv');
    expect(t.header).toEqual(['a', 'b']);
    expect(t.rows).toEqual([['1', '2'], ['3', '4']]);
    expect(t.rowNumbers).toEqual([4, 7]);
  });

  it('drops a UTF-8 byte order mark and trims header names', () => {
    expect(parseCsv('\ufeff timestamp , price\n1,2\n', 'bom.csv').header).toEqual(['timestamp', 'price']);
  });

  it('reads the last row without a final line break', () => {
    expect(parseCsv('a,b\n1,2', 'n.csv').rows).toEqual([['1', '2']]);
  });

  it('gives no rows for a header alone', () => {
    expect(parseCsv('a,b\n', 'h.csv').rows).toEqual([]);
  });

  it('refuses an empty file', () => {
    for (const text of ['', '\n\n', ' , \n']) {
      expect(() => parseCsv(text, 'e.csv')).toThrow(InputError);
      expect(() => parseCsv(text, 'e.csv')).toThrow('e.csv: the file is empty; it needs a header row and data rows');
    }
  });

  it('refuses a row with the wrong number of cells, naming its line and the separator it was read with', () => {
    expect(() => parseCsv('a,b\n1,2\n\n3\n', 'r.csv')).toThrow("r.csv: row 4: has 1 cell but the header has 2 columns (the file reads as ','-separated); check this row for a stray ',' or an unclosed quote");
    expect(() => parseCsv('a,b\n1,2,3\n', 'r.csv')).toThrow('r.csv: row 2: has 3 cells but the header has 2 columns');
    expect(() => parseCsv('a;b\n1;2;3\n1;2\n', 'r.csv')).toThrow("r.csv: row 2: has 3 cells but the header has 2 columns (the file reads as ';'-separated)");
  });

  it('refuses a quoted cell that is never closed, naming its line', () => {
    expect(() => parseCsv('timestamp,price\n2025-01-01T00:00Z,1\n"2025-01-01T01:00Z,2\n', 'u.csv')).toThrow('u.csv: row 3: a quoted cell is not closed');
  });
});
