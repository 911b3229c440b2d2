import { describe, expect, it } from 'vitest';
import { holiday } from '../../src/functions/holiday';

describe('holiday', () => {
  it('holiday(serial, "DE") names German Unity Day on 2025-10-03', () => {
    // 3 October: Einigungsvertrag (1990), Art. 2(2); serial 45933 is 2025-10-03 (1900 date system)
    expect(holiday(45933, 'DE')).toBe('Tag der Deutschen Einheit');
  });

  it('holiday(text, region) reads ISO dates and ignores a time of day', () => {
    expect(holiday('2025-07-14', 'FR')).toBe(holiday(45852.75, 'FR'));
    expect(holiday('2025-07-14T09:00:00+02:00', 'FR')).toMatch(/Fête Nationale/);
  });

  it('holiday gives empty text on an ordinary day', () => {
    expect(holiday('2025-10-07', 'DE')).toBe('');
  });

  it('holiday reads the 1904 date system when the workbook uses it', () => {
    expect(holiday(45933 - 1462, 'DE', { dateSystem: '1904' })).toBe('Tag der Deutschen Einheit');
  });

  it('holiday refuses an empty date, a missing or unknown region', () => {
    expect(() => holiday('', 'DE')).toThrow(/date is empty/);
    expect(() => holiday(45933, null)).toThrow(/give a region/);
    expect(() => holiday(45933, 'XX')).toThrow(/holiday region "XX"/);
  });
});
