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
