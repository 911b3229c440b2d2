import { describe, expect, it } from 'vitest';
import { solarShare } from '../../../src/engine/demo/solar-share';

const BERLIN = [52.5, 13.4] as const;
const ADELAIDE = [-34.9, 138.6] as const;

describe('solarShare(utcMs, latitude, longitude)', () => {
  it('matches the noon elevation 90° − φ + δ at the June solstice (textbook solar geometry)', () => {
    // Solar noon at 13.4° E is about 12:00 − 13.4/15 h = 11:06 UTC; δ ≈ +23.44° on 21 June.
    const noon = Date.UTC(2025, 5, 21, 11, 6);
    const elevation = ((90 - BERLIN[0] + 23.44) * Math.PI) / 180;
    expect(solarShare(noon, ...BERLIN)).toBeCloseTo(Math.sin(elevation) ** 1.15, 2);
  });

  it('is zero at night and highest near solar noon', () => {
    expect(solarShare(Date.UTC(2025, 5, 21, 23, 0), ...BERLIN)).toBe(0);
    const day = Array.from({ length: 24 * 4 }, (_, q) => solarShare(Date.UTC(2025, 5, 21) + q * 900_000, ...BERLIN));
    const peak = day.indexOf(Math.max(...day));
    expect(Math.abs(peak / 4 - 11.1)).toBeLessThanOrEqual(0.25);
    for (const v of day) expect(v >= 0 && v <= 1).toBe(true);
  });

  it('is larger in the local summer: June in Berlin, December in Adelaide', () => {
    const berlinNoon = (m: number) => solarShare(Date.UTC(2025, m, 21, 11, 6), ...BERLIN);
    expect(berlinNoon(5)).toBeGreaterThan(2 * berlinNoon(11));
    // Adelaide solar noon ≈ 12:00 − 138.6/15 h = 02:46 UTC.
    const adelaideNoon = (m: number) => solarShare(Date.UTC(2025, m, 21, 2, 46), ...ADELAIDE);
    expect(adelaideNoon(11)).toBeGreaterThan(1.3 * adelaideNoon(5));
  });

  it('gives about 16 h of daylight at 52.5° N in late June and about 7.7 h in late December (from memory)', () => {
    const hoursOfSun = (y: number, m: number, d: number) => {
      let n = 0;
      for (let q = 0; q < 24 * 60; q++) if (solarShare(Date.UTC(y, m, d) + q * 60_000, ...BERLIN) > 0) n++;
      return n / 60;
    };
    expect(hoursOfSun(2025, 5, 21)).toBeGreaterThan(16);
    expect(hoursOfSun(2025, 5, 21)).toBeLessThan(17);
    expect(hoursOfSun(2025, 11, 21)).toBeGreaterThan(7.2);
    expect(hoursOfSun(2025, 11, 21)).toBeLessThan(8.2);
  });
});
