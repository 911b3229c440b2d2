import { describe, expect, it } from 'vitest';
import { DateTime, IANAZone } from 'luxon';
import { DEMO_MARKET, SOLAR_MARKET } from '../../../src/engine/demo/markets';
import { dayNumber } from '../../../src/engine/calendar/weekday';
import { holidayName } from '../../../src/engine/calendar/holidays';

const years = (start: string, end: string) => (dayNumber(end) - dayNumber(start) + 1) / 365.25;
const hasDst = (zone: string) =>
  DateTime.fromISO('2025-01-15', { zone }).offset !== DateTime.fromISO('2025-07-15', { zone }).offset;

describe('DEMO_MARKET', () => {
  it('is hourly on Europe/Berlin clocks, about 2.5 years ending 30 November 2026', () => {
    expect(DEMO_MARKET.resolution).toBe(60);
    expect(DEMO_MARKET.zone).toBe('Europe/Berlin');
    expect(DEMO_MARKET.end).toBe('2026-11-30');
    expect(years(DEMO_MARKET.start, DEMO_MARKET.end)).toBeGreaterThan(2.4);
    expect(years(DEMO_MARKET.start, DEMO_MARKET.end)).toBeLessThan(2.6);
    expect(DEMO_MARKET.extraDrivers).toEqual([]);
    expect(holidayName('2025-12-25', DEMO_MARKET.region)).not.toBe('');
  });
});

describe('SOLAR_MARKET', () => {
  it('is quarter-hourly in a zone with summer time, about 1.5 years, solar forecast published', () => {
    expect(SOLAR_MARKET.resolution).toBe(15);
    expect(IANAZone.isValidZone(SOLAR_MARKET.zone)).toBe(true);
    expect(hasDst(SOLAR_MARKET.zone)).toBe(true);
    expect(SOLAR_MARKET.zone).not.toBe(DEMO_MARKET.zone);
    expect(years(SOLAR_MARKET.start, SOLAR_MARKET.end)).toBeGreaterThan(1.4);
    expect(years(SOLAR_MARKET.start, SOLAR_MARKET.end)).toBeLessThan(1.6);
    expect(SOLAR_MARKET.extraDrivers).toContain('solar_forecast');
    expect(SOLAR_MARKET.supply.solarMW).toBeGreaterThan(0.5 * SOLAR_MARKET.load.baseMW);
  });
});

describe('both markets', () => {
  it('carry invented names that say so in their description', () => {
    for (const m of [DEMO_MARKET, SOLAR_MARKET]) {
      expect(m.name.length).toBeGreaterThan(0);
      expect(m.company.length).toBeGreaterThan(0);
      expect(m.description).toMatch(/invented/);
      expect(m.description).toContain(m.name);
    }
    expect(DEMO_MARKET.name).not.toBe(SOLAR_MARKET.name);
  });
});
