import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import {
  ALL_FEATURE_GROUPS, dayFeatures, dayFrame, dayIndexOf, featureLayout, featureNames, frameBefore, historyNeeded,
  type DayFrame, type FeatureGroup, type FeatureSetup, type Resolution, type Series,
} from '../../../src/engine';
import { toScaled } from '../../../src/engine/features/level-scale';

/** A seeded Berlin series with a load and a wind driver, built directly in the series layout (series.ts). */
function series(days: number, resolution: Resolution, startUtc = '2023-11-30T23:00:00Z'): Series {
  const rng = seedrandom(`features-${resolution}`);
  const step = resolution * 60_000, n = (days * 1440) / resolution, t0 = Date.parse(startUtc);
  const times: number[] = [], price: number[] = [], load: number[] = [], wind: number[] = [];
  for (let k = 0; k < n; k++) {
    const t = t0 + k * step;
    const h = new Date(t).getUTCHours() + new Date(t).getUTCMinutes() / 60;
    const l = 50 + 15 * Math.sin(((h - 7) / 24) * 2 * Math.PI) + 3 * rng();
    const w = 10 + 8 * rng();
    times.push(t); load.push(l); wind.push(w);
    price.push(10 + 1.2 * (l - w) + 5 * (rng() - 0.5));
  }
  return { times, price, drivers: { load_forecast: load, wind_forecast: wind }, resolution, zone: 'Europe/Berlin' };
}

function setupFor(frame: DayFrame, groups: FeatureGroup[] = [...ALL_FEATURE_GROUPS]): FeatureSetup {
  const driverStats: FeatureSetup['driverStats'] = {};
  for (const [name, rows] of Object.entries(frame.drivers)) {
    const v = rows.flatMap((r) => Array.from(r)).filter(Number.isFinite);
    const mean = v.reduce((a, b) => a + b, 0) / v.length;
    driverStats[name] = { mean, sd: Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / v.length) };
  }
  return { groups, drivers: Object.keys(frame.drivers), driverStats, region: 'DE', scaleWindow: 28, slots: frame.slots };
}

const hourlyFrame = dayFrame(series(400, 60));
const quarterFrame = dayFrame(series(372, 15));

describe('featureNames(setup) and dayFeatures(view, setup) agree', () => {
  it.each([
    ['hourly', hourlyFrame, 24 * 4 + 3 + 24 + 2 + 2 * 24 + 2 * 48 + 24 + 7 + 2 + 3],
    ['15-minute', quarterFrame, 96 * 2 + 24 * 2 + 3 + 24 + 2 + 2 * 24 + 2 * 48 + 24 + 7 + 2 + 3],
  ])('on a %s frame with every group, the names are as many as the features', (_what, frame, count) => {
    const setup = setupFor(frame);
    const names = featureNames(setup);
    // count worked by hand from the group labels: D-1 and D-7 at full resolution, D-2, D-3 and the rest hourly
    expect(names).toHaveLength(count);
    expect(new Set(names).size).toBe(names.length);
    const f = dayFeatures(frameBefore(frame, 370), setup)!;
    expect(f.x).toHaveLength(names.length);
  });

  it.each([
    [['price_lags'] as FeatureGroup[]],
    [['weekday', 'month'] as FeatureGroup[]],
    [['drivers_lagged', 'residual_load', 'price_d1_stats', 'price_changes'] as FeatureGroup[]],
  ])('with groups %j only', (groups) => {
    for (const frame of [hourlyFrame, quarterFrame]) {
      const setup = setupFor(frame, groups);
      expect(dayFeatures(frameBefore(frame, 100), setup)!.x).toHaveLength(featureNames(setup).length);
      expect(featureLayout(setup).map((g) => g.group)).toEqual(ALL_FEATURE_GROUPS.filter((g) => groups.includes(g)));
    }
  });

  it('leaves out holidays without a region and residual load without a renewable driver', () => {
    const setup = { ...setupFor(hourlyFrame), region: undefined, drivers: ['load_forecast'] };
    const groups = featureLayout(setup).map((g) => g.group);
    expect(groups).not.toContain('holidays');
    expect(groups).not.toContain('residual_load');
    expect(dayFeatures(frameBefore(hourlyFrame, 370), setup)!.x).toHaveLength(featureNames(setup).length);
  });
});

describe('dayFeatures(view, setup) reads no data from the target day on', () => {
  const d = 380;
  const setup = setupFor(hourlyFrame);
  const base = dayFeatures(frameBefore(hourlyFrame, d), setup)!.x;
  /** features of day d after changing one value (day, slot) of a copy of the frame */
  const after = (change: (f: DayFrame) => void, view = (f: DayFrame) => frameBefore(f, d)) => {
    const copy: DayFrame = {
      ...hourlyFrame,
      price: hourlyFrame.price.map((r) => Float64Array.from(r)),
      drivers: Object.fromEntries(Object.entries(hourlyFrame.drivers).map(([k, rows]) => [k, rows.map((r) => Float64Array.from(r))])),
    };
    change(copy);
    return dayFeatures(view(copy), setup)?.x;
  };

  it('changes when a price of D-1 changes', () => {
    expect(after((f) => { f.price[d - 1][5] += 10; })).not.toEqual(base);
  });

  it('changes when a price of D-364 (year ago) or a driver of D changes', () => {
    expect(after((f) => { f.price[d - 364][5] += 10; })).not.toEqual(base);
    expect(after((f) => { f.drivers.load_forecast[d][5] += 10; })).not.toEqual(base);
  });

  it('does not change when a price of D changes in the series (the frame for D holds no price of D)', () => {
    const s = series(400, 60);
    for (let j = 0; j < 24; j++) s.price[hourlyFrame.days[d].start + j] += 10;
    expect(dayFeatures(frameBefore(dayFrame(s), d), setup)!.x).toEqual(base);
  });

  it('does not change when a driver of D+1 changes, even when the view holds the rows of D+1', () => {
    const withTomorrow = (f: DayFrame) => ({ ...f, days: f.days.slice(0, d + 2), price: f.price.slice(0, d) });
    expect(dayFeatures(withTomorrow(hourlyFrame), setup)!.x).toEqual(base);
    expect(after((f) => { f.drivers.load_forecast[d + 1][5] += 10; f.drivers.wind_forecast[d + 1][0] += 10; }, withTomorrow)).toEqual(base);
  });

  it('does not change when a price outside its lags and scale window changes (D-29)', () => {
    expect(after((f) => { f.price[d - 29][5] += 10; })).toEqual(base);
  });
});

describe('dayFeatures(view, setup) values', () => {
  it('is undefined before historyNeeded days and when an input of the day is unknown', () => {
    const setup = setupFor(hourlyFrame);
    expect(dayFeatures(frameBefore(hourlyFrame, setup.scaleWindow - 1), setup)).toBeUndefined();
    expect(dayFeatures(frameBefore(hourlyFrame, setup.scaleWindow), setup)).toBeDefined();
    const gap = { ...frameBefore(hourlyFrame, 370), drivers: { ...hourlyFrame.drivers, load_forecast: hourlyFrame.drivers.load_forecast.map((r, i) => (i === 370 ? r.map(() => NaN) : r)) } };
    expect(dayFeatures(gap, setup)).toBeUndefined();
  });

  it('codes the weekday (ISO 8601, Monday = 1), the month and German public holidays', () => {
    const setup = setupFor(hourlyFrame, ['weekday', 'month', 'holidays']);
    const at = (date: string) => dayFeatures(frameBefore(hourlyFrame, dayIndexOf(hourlyFrame, date)), setup)!.x;
    // 2024-12-25 is a Wednesday (ISO weekday 3) and a public holiday in all German states, as is 2024-12-26 (from memory)
    const christmas = at('2024-12-25');
    expect(Array.from(christmas.slice(0, 7))).toEqual([0, 0, 1, 0, 0, 0, 0]);
    expect(christmas[7]).toBeCloseTo(Math.sin((2 * Math.PI * 11) / 12), 12);
    expect(christmas[8]).toBeCloseTo(Math.cos((2 * Math.PI * 11) / 12), 12);
    expect(Array.from(christmas.slice(9))).toEqual([1, 0, 0]);
    expect(Array.from(at('2024-12-26').slice(9))).toEqual([1, 0, 1]);
    expect(Array.from(at('2024-12-27').slice(9))).toEqual([0, 1, 1]); // a Friday between a holiday and the weekend: bridge day
    expect(Array.from(at('2024-12-30').slice(0, 7))).toEqual([1, 0, 0, 0, 0, 0, 0]);
  });
});

describe('dayFeatures(view, setup) with price_year_ago less than a year into the history', () => {
  it('takes 0, the centre of the level scale, for each hour of the missing year-ago day, and the prices from day 364 on', () => {
    const setup = setupFor(hourlyFrame, ['price_year_ago']);
    expect(Array.from(dayFeatures(frameBefore(hourlyFrame, 363), setup)!.x)).toEqual(new Array(24).fill(0));
    const f = dayFeatures(frameBefore(hourlyFrame, 364), setup)!;
    expect(Array.from(f.x)).toEqual(Array.from(hourlyFrame.price[0]).map((p) => toScaled(p, f.scale)));
  });
});

describe('historyNeeded(setup)', () => {
  const base = setupFor(hourlyFrame);
  it.each([
    // the year-ago prices need no history: a day without them takes 0 there
    [[...ALL_FEATURE_GROUPS], 28, 28],
    [['price_lags', 'price_changes'], 28, 28],
    [['price_lags', 'price_changes'], 7, 8],
    [['price_lags'], 7, 7],
    [['weekday'], 60, 60],
  ] as [FeatureGroup[], number, number][])('groups %j with a %d-day scale window need %d days', (groups, scaleWindow, days) => {
    expect(historyNeeded({ ...base, groups, scaleWindow })).toBe(days);
  });

  it('is the first day with features: with price_changes and a 7-day window, day 8 and not day 7', () => {
    const setup = { ...base, groups: ['price_lags', 'price_changes'] as FeatureGroup[], scaleWindow: 7 };
    expect(dayFeatures(frameBefore(hourlyFrame, 7), setup)).toBeUndefined();
    expect(dayFeatures(frameBefore(hourlyFrame, 8), setup)).toBeDefined();
  });
});
