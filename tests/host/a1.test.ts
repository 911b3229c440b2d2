import { describe, expect, it } from 'vitest';
import { columnName, formatA1, MAX_COLUMNS, MAX_ROWS, parseA1, rangeSize, resizeAddress } from '../../src/host/a1';

describe('a1', () => {
  it('parseA1("History!A2:C900") gives the sheet and the 0-based block', () => {
    expect(parseA1('History!A2:C900')).toEqual({ sheet: 'History', row: 1, column: 0, rows: 899, columns: 3 });
  });

  it('parseA1 reads quoted sheet names, absolute markers and reversed corners', () => {
    expect(parseA1("'Price history'!$B$3")).toEqual({ sheet: 'Price history', row: 2, column: 1, rows: 1, columns: 1 });
    expect(parseA1("'Bob''s'!C5:A1")).toEqual({ sheet: "Bob's", row: 0, column: 0, rows: 5, columns: 3 });
  });

  it('formatA1 inverts parseA1 and quotes sheet names that need it', () => {
    for (const a of ['A1', 'B2:D40', 'History!A2:C900', "'Price history'!A1:B2", "'Bob''s'!C3"]) expect(formatA1(parseA1(a))).toBe(a);
  });

  it('columnName(index) counts A..Z, AA.., up to XFD', () => {
    // ECMA-376 Part 1 §18.3.1.4: 16 384 columns, the last is XFD
    expect([0, 25, 26, 701, 702, MAX_COLUMNS - 1].map(columnName)).toEqual(['A', 'Z', 'AA', 'ZZ', 'AAA', 'XFD']);
  });

  it('rangeSize and resizeAddress keep the top-left cell', () => {
    expect(rangeSize('B2:D40')).toEqual({ rows: 39, columns: 3 });
    expect(resizeAddress('Out!C3', 24, 2)).toBe('Out!C3:D26');
  });

  it('parseA1 refuses what is not an address, or lies outside the sheet', () => {
    expect(() => parseA1('A:A')).toThrow(/is not an A1 address/);
    expect(() => parseA1(`A${MAX_ROWS + 1}`)).toThrow(/outside the sheet/);
    expect(() => parseA1('XFE1')).toThrow(/outside the sheet/);
  });
});
