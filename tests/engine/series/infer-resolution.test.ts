import { describe, expect, it } from 'vitest';
import { inferResolution, InputError } from '../../../src/engine';

const minutes = (...m: number[]) => m.map((x) => x * 60_000);

describe('inferResolution(sortedTimes)', () => {
  it.each([[15], [30], [60]])('finds %d-minute periods', (step) => {
    expect(inferResolution(minutes(...Array.from({ length: 10 }, (_, k) => k * step)))).toBe(step);
  });

  it('reproduces its doc example', () => {
    expect(inferResolution([0, 3.6e6, 7.2e6])).toBe(60);
  });

  it('takes the most common step, so gaps do not change it', () => {
    expect(inferResolution(minutes(0, 60, 120, 300, 360, 420, 1000))).toBe(60);
    expect(inferResolution(minutes(0, 15, 30, 45, 120, 180))).toBe(15);
  });

  it('takes the shorter step on a tie', () => {
    expect(inferResolution(minutes(0, 15, 30, 90, 150))).toBe(15);
    expect(inferResolution(minutes(0, 60, 120, 150, 180))).toBe(30);
  });

  it('refuses fewer than 2 periods', () => {
    expect(() => inferResolution([])).toThrow(InputError);
    expect(() => inferResolution([0])).toThrow('the resolution can only be found with at least 2 periods');
  });

  it.each([
    [minutes(0, 20, 40, 60), 20],
    [minutes(0, 5, 10), 5],
    [minutes(0, 1440, 2880), 1440],
    [minutes(0, 0, 0), 0],
  ])('refuses steps of other lengths (%j)', (times, step) => {
    expect(() => inferResolution(times)).toThrow(`periods are ${step} minutes apart; Spotloom handles 15, 30 or 60 minute delivery periods`);
  });
});
