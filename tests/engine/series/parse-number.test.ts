import { describe, expect, it } from 'vitest';
import { InputError, parseNumber } from '../../../src/engine';

describe('parseNumber(text)', () => {
  it('reads plain decimals, exponents and blanks (unknown)', () => {
    expect(parseNumber(' -12.5 ')).toBe(-12.5);
    expect(parseNumber('1e3')).toBe(1000);
    expect(parseNumber('.5')).toBe(0.5);
    expect(parseNumber('')).toBeNaN();
  });

  it.each(['NaN', 'Infinity', '1,5', '0x10'])('refuses %s', (text) => {
    expect(() => parseNumber(text)).toThrow(InputError);
  });

  it.each(['1e999', '-1e400', '2e308'])('refuses %s, which overflows to Infinity (found by tests/fuzz/scalars)', (text) => {
    expect(() => parseNumber(text)).toThrow(/too large/);
  });

  it('keeps the largest finite double and underflow to zero', () => {
    expect(parseNumber('1.7976931348623157e308')).toBe(Number.MAX_VALUE);
    expect(parseNumber('1e-400')).toBe(0);
  });
});

// ISO 80000-1:2022, 7.3.2: the decimal sign is a comma or a point; digits may be grouped in threes.
describe('parseNumber(text, where, ",") with the decimal comma', () => {
  it('reads decimal commas, "." grouping thousands and exponents to the same doubles as the plain text', () => {
    expect(parseNumber('41,25', undefined, ',')).toBe(41.25);
    expect(parseNumber('-0,5', undefined, ',')).toBe(-0.5);
    expect(parseNumber(',5', undefined, ',')).toBe(0.5);
    expect(parseNumber('5,', undefined, ',')).toBe(5);
    expect(parseNumber('1.234,5', undefined, ',')).toBe(1234.5);
    expect(parseNumber('6.012', undefined, ',')).toBe(6012);
    expect(parseNumber('1.234.567,891', undefined, ',')).toBe(1234567.891);
    expect(parseNumber('2,5E-3', undefined, ',')).toBe(0.0025);
    expect(parseNumber(' 12 ', undefined, ',')).toBe(12);
    expect(parseNumber('', undefined, ',')).toBeNaN();
  });

  it.each(['12.5', '1.23,4', '0.123', '1,2,3', '1.2345', 'NaN', ',', '-'])('refuses %s, naming the decimal comma', (text) => {
    expect(() => parseNumber(text, { file: 'f.csv', row: 3, column: 'price' }, ',')).toThrow(/^f\.csv: row 3, column "price": ".*" is not a number with a decimal comma \(write it like 41,25 or 1\.234,5\)$/);
  });

  it('refuses a decimal comma when the mark is the point', () => {
    expect(() => parseNumber('41,25')).toThrow(/use \. as decimal separator/);
  });
});
