import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/engine';
import { cellGrid, cellList, cellNumber, isBlank, isOmitted, numberArg, numberText, textArg } from '../../src/functions/cells';

describe('cells', () => {
  it('isBlank(v) is true for null, undefined, empty and white-space text only', () => {
    expect([null, undefined, '', '  '].map(isBlank)).toEqual([true, true, true, true]);
    expect([0, 'x', false].map(isBlank)).toEqual([false, false, false]);
  });

  it('isOmitted(v) also takes a single empty cell as omitted', () => {
    expect(isOmitted(null)).toBe(true);
    expect(isOmitted([['']])).toBe(true);
    expect(isOmitted([[0]])).toBe(false);
    expect(isOmitted([[''], ['']])).toBe(false);
  });

  it('cellList(range) reads a column, a row or a single value in order', () => {
    expect(cellList([[1], [2], ['']], 'prices')).toEqual([1, 2, '']);
    expect(cellList([[1, 2, 3]], 'prices')).toEqual([1, 2, 3]);
    expect(cellList(5, 'prices')).toEqual([5]);
  });

  it('cellList(range) refuses a block of several rows and columns, naming it', () => {
    expect(() => cellList([[1, 2], [3, 4]], 'prices')).toThrow(/prices must be one column.*2 rows and 2 columns/);
  });

  it('cellGrid(range) makes a single value 1 × 1', () => {
    expect(cellGrid(3)).toEqual([[3]]);
    expect(cellGrid([[1, 2]])).toEqual([[1, 2]]);
  });

  it('cellNumber(v) is NaN for an empty cell, never 0', () => {
    expect(cellNumber('', { row: 1 })).toBeNaN();
    expect(cellNumber(null, { row: 1 })).toBeNaN();
  });

  it('cellNumber(v) reads numbers and numeric text with a decimal point', () => {
    expect(cellNumber(-12.5, {})).toBe(-12.5);
    expect(cellNumber(' 41.25 ', {})).toBe(41.25);
  });

  it('cellNumber(v) refuses other text, TRUE/FALSE and error values, saying where', () => {
    expect(() => cellNumber('41,25', { column: 'prices', row: 7 })).toThrow(/row 7, column "prices": "41,25" is not a number/);
    expect(() => cellNumber(true, { row: 2 })).toThrow(InputError);
    expect(() => cellNumber({ type: 'Error' }, { row: 2 })).toThrow(/error/);
  });

  it('numberText(v) gives the engine text form, empty for unknown', () => {
    expect(numberText(3, {})).toBe('3');
    expect(numberText('', {})).toBe('');
  });

  it('textArg and numberArg fall back when omitted and read 1 × 1 ranges', () => {
    expect(textArg(null, 'kind', 'week')).toBe('week');
    expect(textArg([[' day ']], 'kind', 'week')).toBe('day');
    expect(() => textArg(5, 'kind', 'week')).toThrow(/kind must be text/);
    expect(numberArg(null, 'coverage', 0.9)).toBe(0.9);
    expect(numberArg([[0.8]], 'coverage', 0.9)).toBe(0.8);
  });
});
