import { describe, expect, it } from 'vitest';
import { cellText, typedValue } from '../../src/preview/cell-text';

describe('cellText(value)', () => {
  it('rounds for the eye: two decimals, four significant digits below 1, whole numbers as they are', () => {
    expect(cellText(41.23456)).toBe('41.23');
    expect(cellText(-12.346)).toBe('-12.35');
    expect(cellText(0.0123456)).toBe('0.01235');
    expect(cellText(9625)).toBe('9625');
    expect(cellText(1.5e12 + 0.5)).toBe('1.500e+12');
    expect(cellText(1.5e12)).toBe('1500000000000');
  });

  it('writes booleans as TRUE/FALSE, empty as nothing, text as it is', () => {
    expect([cellText(true), cellText(false), cellText(null), cellText('#VALUE!')]).toEqual(['TRUE', 'FALSE', '', '#VALUE!']);
  });
});

describe('cellText(value, format)', () => {
  // what the host shows for these format codes (ECMA-376 Part 1, 18.8.31; from memory)
  it('fixed decimals, per cent and the date-time of a 1900-system serial', () => {
    expect(cellText(41.005, '0.00')).toBe('41.01');
    expect(cellText(7, '0.00')).toBe('7.00');
    expect(cellText(0.62345, '0.000')).toBe('0.623');
    expect(cellText(0.8958, '0.0%')).toBe('89.6%');
    expect(cellText(1, '0.0%')).toBe('100.0%');
    expect(cellText(45956 + 2 / 24, 'yyyy-mm-dd hh:mm')).toBe('2025-10-26 02:00');
    expect(cellText('text', '0.00')).toBe('text');
    expect(cellText(41.23456, 'some other code')).toBe('41.23');
  });
});

describe('typedValue(text)', () => {
  it('turns typed text into a formula, a number (. decimal), a boolean, empty or text', () => {
    expect(typedValue('=LOOM.HOLIDAY("2026-10-03", "DE")')).toBe('=LOOM.HOLIDAY("2026-10-03", "DE")');
    expect(typedValue(' 12.5 ')).toBe(12.5);
    expect(typedValue('-1e3')).toBe(-1000);
    expect(typedValue('true')).toBe(true);
    expect(typedValue('   ')).toBeNull();
    expect(typedValue('12,5')).toBe('12,5');
    expect(typedValue('1e999')).toBe('1e999');
  });
});
