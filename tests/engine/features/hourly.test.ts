import { describe, expect, it } from 'vitest';
import { hourly } from '../../../src/engine/features/hourly';

describe('hourly(row, slotsPerHour)', () => {
  it('averages half-hours and quarter-hours to 24 hourly values (arithmetic mean, worked by hand)', () => {
    const half = Float64Array.from({ length: 48 }, (_, k) => 2 * k + 1); // hour h: (4h+1 + 4h+3) / 2 = 4h + 2
    const out = hourly(half, 2);
    expect(out).toHaveLength(24);
    expect(Array.from(out)).toEqual(Array.from({ length: 24 }, (_, h) => 4 * h + 2));
    const quarter = Float64Array.from({ length: 96 }, (_, k) => k % 4); // 0, 1, 2, 3 in every hour: mean 1.5
    expect(Array.from(hourly(quarter, 4))).toEqual(new Array(24).fill(1.5));
  });

  it('reproduces its doc example', () => {
    expect(Array.from(hourly(Float64Array.from([1, 3, 5, 7]), 2))).toEqual([2, 6]);
  });

  it('gives NaN for an hour with any unknown slot and keeps the other hours', () => {
    const row = Float64Array.from({ length: 96 }, () => 10);
    row[5] = NaN;
    const out = hourly(row, 4);
    expect(out[1]).toBeNaN();
    expect(out[0]).toBe(10);
    expect(out[2]).toBe(10);
  });

  it('passes hourly rows through unchanged', () => {
    const row = Float64Array.from({ length: 24 }, (_, k) => k - 3.5);
    expect(hourly(row, 1)).toBe(row);
  });
});
