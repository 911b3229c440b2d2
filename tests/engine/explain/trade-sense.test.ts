import { describe, expect, it } from 'vitest';
import {
  buildSeries, createModel, DEMO_MARKET, explainAhead, frameBefore, generateMarket, inputFrame, parseCsv, sensitivityAhead, toCsv, withDriverStep,
  type Learner, type Series,
} from '../../../src/engine';
import { SMALL } from './trained';

/**
 * The demo market (invented, engine/demo) with its wind forecast published,
 * from 2025-09-01: the last day, 2026-11-30, is tomorrow (drivers, no price).
 */
function demoWithWind(): { series: Series; drivers: string[] } {
  const rows = generateMarket({ ...DEMO_MARKET, start: '2025-09-01', extraDrivers: ['wind_forecast'] }, 1);
  const { series } = buildSeries(parseCsv(toCsv(rows), 'demo.csv'), { zone: DEMO_MARKET.zone });
  const first = series.times.findIndex((_, i) => rows[i].timestamp.startsWith(DEMO_MARKET.end));
  return { series: { ...series, price: series.price.map((p, i) => (i >= first ? NaN : p)) }, drivers: Object.keys(series.drivers) };
}

describe('trade sense on the demo market (common practice: more wind or solar lowers the price through the merit order; more load raises it)', () => {
  const { series, drivers } = demoWithWind();
  const frame = inputFrame(series);
  it.each(['linear', 'blend'] as const)('%s: +30 per cent wind for tomorrow lowers the forecast and the target-day drivers\' contribution', (kind) => {
    expect(drivers).toEqual(['temperature_forecast', 'load_forecast', 'wind_forecast']);
    const model = createModel(kind, { ...SMALL, region: DEMO_MARKET.region }) as Learner;
    model.fit(frameBefore(frame, frame.price.length));
    const base = explainAhead(model, series, drivers);
    expect(base.day).toBe(DEMO_MARKET.end);
    const windy = explainAhead(model, withDriverStep(series, base.day, { driver: 'wind_forecast', kind: 'percent', amount: 30 }), drivers);
    const group = (e: typeof base, g: string) => e.contributions.find((c) => c.group === g)!.value;
    expect(windy.forecastMean).toBeLessThan(base.forecastMean);
    // residual load (load minus wind) is its own group; wind enters the target-day drivers too
    expect(group(windy, 'drivers_target') + group(windy, 'residual_load')).toBeLessThan(group(base, 'drivers_target') + group(base, 'residual_load'));
    expect(group(windy, 'drivers_target')).toBeLessThan(group(base, 'drivers_target'));
    // the reference day is untouched by a what-if on tomorrow
    expect(windy.referenceForecastMean).toBe(base.referenceForecastMean);
    const sens = sensitivityAhead(model, series, drivers);
    const per = (name: string) => sens.drivers.find((s) => s.driver === name)!.mean;
    expect(per('wind_forecast')).toBeLessThan(0);
    expect(per('load_forecast')).toBeGreaterThan(0);
  }, 120_000);
});
