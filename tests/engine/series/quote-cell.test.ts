import { describe, expect, it } from 'vitest';
import { parseNumber, parseTimestamp, checkZone } from '../../../src/engine';
import { quoteCell } from '../../../src/engine/series/quote-cell';

describe('quoteCell(text)', () => {
  it('quotes, trims and escapes line breaks and control characters', () => {
    expect(quoteCell(' 12,5\r ')).toBe('"12,5"');
    expect(quoteCell('a\r\nb')).toBe('"a\\r\\nb"');
    expect(quoteCell('a\u0000b\u2028c')).toBe('"a\\u0000b\\u2028c"');
  });

  it('clips long text', () => {
    expect(quoteCell('x'.repeat(100))).toBe(`"${'x'.repeat(40)}…"`);
  });
});

describe('messages about a cell stay on one line (found by tests/fuzz/scalars: a cell "\\u{41a08}\\u{ba188}\\r")', () => {
  it.each([
    () => parseTimestamp('2025-01-01\r\n00:00Z'),
    () => parseTimestamp('x\r'),
    () => parseNumber('1\n2'),
    () => checkZone('Europe/\nBerlin'),
  ])('%#', (f) => {
    expect(f).toThrow(/^[^\r\n]+$/);
  });
});
