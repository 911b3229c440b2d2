import { describe, expect, it } from 'vitest';
import { dayFeatures, dayFrame, frameBefore, historyNeeded, type DayFrame, type FeatureSetup } from '../../../src/engine';
import { toScaled } from '../../../src/engine/features/level-scale';
import { FeatureCache } from '../../../src/engine/models/training-days';
import { syntheticSeries } from '../../support/synthetic';

const frame = () => dayFrame(syntheticSeries(80));
const setupOf = (f: DayFrame): FeatureSetup => ({
  groups: ['price_lags', 'drivers_target', 'weekday'],
  drivers: ['load_forecast'],
  driverStats: { load_forecast: { mean: 50, sd: 15 } },
  scaleWindow: 14,
  slots: f.slots,
});

describe('FeatureCache.features(frame, d)', () => {
  it('returns the same object for a day on any view cut from one frame', () => {
    const f = frame();
    const cache = new FeatureCache(setupOf(f));
    const first = cache.features(frameBefore(f, 60), 30)!;
    expect(first).toBeDefined();
    expect(cache.features(f, 30)).toBe(first);
    expect(cache.features(frameBefore(f, 31), 30)).toBe(first);
    expect(cache.features(frameBefore(frameBefore(f, 70), 45), 30)).toBe(first);
  });

  it('holds the features of dayFeatures on the view before the day', () => {
    const f = frame();
    const setup = setupOf(f);
    expect(new FeatureCache(setup).features(f, 40)).toEqual(dayFeatures(frameBefore(f, 40), setup));
  });

  it('does not share entries between frames built separately', () => {
    const a = frame(), b = frame();
    const cache = new FeatureCache(setupOf(a));
    b.price[39][0] += 50; // D-1 of day 40 in b only
    expect(cache.features(b, 40)!.x).not.toEqual(cache.features(a, 40)!.x);
  });

  it('remembers a day without features as undefined', () => {
    const f = frame();
    const cache = new FeatureCache(setupOf(f));
    expect(cache.features(f, 3)).toBeUndefined();
    expect(cache.features(f, 3)).toBeUndefined();
  });
});

describe('FeatureCache.trainingDays(view, from, to)', () => {
  it('gives every day from historyNeeded on with its features and scaled prices as targets', () => {
    const f = frame();
    const setup = setupOf(f);
    const days = new FeatureCache(setup).trainingDays(f, 0, f.price.length);
    expect(days.map((d) => d.day)).toEqual(Array.from({ length: f.price.length - historyNeeded(setup) }, (_, k) => k + historyNeeded(setup)));
    const d = days[10];
    expect(Array.from(d.y!)).toEqual(Array.from(f.price[d.day], (p) => toScaled(p, d.scale)));
  });

  it('skips days with an unknown target price (and days whose inputs read it)', () => {
    const f = frame();
    f.price[50][3] = NaN;
    const days = new FeatureCache(setupOf(f)).trainingDays(f, 40, 70).map((d) => d.day);
    // day 50: target unknown; days 51, 52, 53 and 57 read day 50 as D-1, D-2, D-3 or D-7
    const expected = Array.from({ length: 30 }, (_, k) => k + 40).filter((d) => ![50, 51, 52, 53, 57].includes(d));
    expect(days).toEqual(expected);
  });

  it('clamps from and to to the days with prices', () => {
    const f = frame();
    const cache = new FeatureCache(setupOf(f));
    const view = frameBefore(f, 60);
    expect(cache.trainingDays(view, -5, 1000).map((d) => d.day)).toEqual(cache.trainingDays(view, 0, 60).map((d) => d.day));
    expect(cache.trainingDays(view, 0, 60).at(-1)!.day).toBe(59);
  });
});
