import { describe, expect, it } from 'vitest';
import { checkMarketSpec, type MarketSpec } from '../../../src/engine/demo/market-spec';
import { DEMO_MARKET, SOLAR_MARKET } from '../../../src/engine/demo/markets';
import { InputError } from '../../../src/engine/errors';

const tweak = (change: (s: MarketSpec) => void): MarketSpec => {
  const s = structuredClone(DEMO_MARKET) as MarketSpec;
  change(s);
  return s;
};

describe('checkMarketSpec(spec)', () => {
  it('accepts both shipped markets', () => {
    expect(() => checkMarketSpec(DEMO_MARKET)).not.toThrow();
    expect(() => checkMarketSpec(SOLAR_MARKET)).not.toThrow();
  });

  it('refuses an unknown time zone or holiday region', () => {
    expect(() => checkMarketSpec(tweak((s) => (s.zone = 'Europe/Atlantis')))).toThrow(/zone "Europe\/Atlantis"/);
    expect(() => checkMarketSpec(tweak((s) => (s.region = 'ZZ')))).toThrow(InputError);
  });

  it('refuses an end before the start and a bad resolution', () => {
    expect(() => checkMarketSpec(tweak((s) => (s.end = '2024-01-01')))).toThrow(/before start/);
    expect(() => checkMarketSpec(tweak((s) => (s.resolution = 20 as 60)))).toThrow(/resolution/);
    expect(() => checkMarketSpec(tweak((s) => (s.start = '2024-02-30')))).toThrow(InputError);
  });

  it('names the field that is out of range', () => {
    expect(() => checkMarketSpec(tweak((s) => (s.load.baseMW = 0)))).toThrow(/load\.baseMW/);
    expect(() => checkMarketSpec(tweak((s) => (s.supply.windMW = -1)))).toThrow(/supply\.windMW/);
    expect(() => checkMarketSpec(tweak((s) => (s.fuel.start = NaN)))).toThrow(/fuel\.start/);
    expect(() => checkMarketSpec(tweak((s) => (s.fuel.reversionPerDay = 1)))).toThrow(/reversionPerDay/);
    expect(() => checkMarketSpec(tweak((s) => (s.latitude = 95)))).toThrow(/latitude/);
    expect(() => checkMarketSpec(tweak((s) => (s.extraDrivers = ['solar_forecast', 'solar_forecast'])))).toThrow(/twice/);
  });
});
