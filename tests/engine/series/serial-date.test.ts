import { describe, expect, it } from 'vitest';
import { InputError, serialToWallClock } from '../../../src/engine';

describe('serialToWallClock(serial) at the end of the 1900 date system', () => {
  it('reads the last minute of 9999-12-31 (serial 2958465 is 9999-12-31, ECMA-376 Part 1, 18.17.4.1)', () => {
    expect(serialToWallClock(2_958_465 + 1439 / 1440)).toEqual({ date: '9999-12-31', minutes: 1439 });
  });

  it('refuses a serial that rounds to 10000-01-01 (2958465.9999999953 gave the date "+010000-01", found by tests/fuzz/scalars)', () => {
    expect(() => serialToWallClock(2_958_465.9999999953)).toThrow(InputError);
    expect(() => serialToWallClock(2_958_465.9999999953)).toThrow(/9999-12-31/);
  });
});
