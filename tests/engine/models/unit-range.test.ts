import { describe, expect, test } from 'vitest';
import { fitUnitRange, fromUnit, toUnit } from '../../../src/engine/models/unit-range';

const f = (...v: number[]) => Float64Array.from(v);

// Targets inside (0.1, 0.9), away from the asymptotes of the sigmoid output: common
// practice (LeCun et al. 1998, "Efficient BackProp", sec. 4.5, from memory). All values
// below are worked by hand from y = 0.1 + 0.8 (z − lo) / (hi − lo).
describe('fitUnitRange(targets)', () => {
  test('widens each slot\'s training range by a quarter, at least 0.5 on each side', () => {
    // slot 1: 0 .. 4, pad max(0.25 · 4, 0.5) = 1 -> -1 .. 5; slot 2: 10 .. 10, pad 0.5 -> 9.5 .. 10.5;
    // slot 3: -8 .. 0, pad 2 -> -10 .. 2
    const r = fitUnitRange([f(0, 10, 0), f(4, 10, -8), f(1, 10, -3)]);
    expect(Array.from(r.lo)).toEqual([-1, 9.5, -10]);
    expect(Array.from(r.hi)).toEqual([5, 10.5, 2]);
  });
});

describe('toUnit(z, range) and fromUnit(u, range)', () => {
  const range = { lo: f(-1, 9.5), hi: f(5, 10.5) };

  test('map the range onto 0.1 .. 0.9 per slot', () => {
    const mid = toUnit(f(2, 10), range); // 0.1 + 0.8 · 3/6, 0.1 + 0.8 · 0.5/1
    expect(mid[0]).toBeCloseTo(0.5, 15);
    expect(mid[1]).toBeCloseTo(0.5, 15);
    const ends = toUnit(f(-1, 10.5), range);
    expect(ends[0]).toBeCloseTo(0.1, 15);
    expect(ends[1]).toBeCloseTo(0.9, 15);
  });

  test('hold values beyond the range just inside (0, 1), at 0.02 and 0.98', () => {
    expect(Array.from(toUnit(f(100, -100), range))).toEqual([0.98, 0.02]);
    // 0.1 + 0.8 · (-2.5 + 1)/6 = -0.1 -> 0.02; 0.1 + 0.8 · (11.5 - 9.5) = 1.7 -> 0.98
    expect(Array.from(toUnit(f(-2.5, 11.5), range))).toEqual([0.02, 0.98]);
  });

  test('fromUnit inverts toUnit inside the range', () => {
    const back = fromUnit(f(0.5, 0.9), range); // -1 + 0.4 · 6 / 0.8 = 2; 9.5 + 0.8 · 1 / 0.8 = 10.5
    expect(back[0]).toBeCloseTo(2, 12);
    expect(back[1]).toBeCloseTo(10.5, 12);
    const z = f(-0.7, 10.2);
    const round = fromUnit(toUnit(z, range), range);
    expect(round[0]).toBeCloseTo(-0.7, 12);
    expect(round[1]).toBeCloseTo(10.2, 12);
  });
});
