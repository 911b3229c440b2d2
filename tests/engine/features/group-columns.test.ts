import { describe, expect, it } from 'vitest';
import { ALL_FEATURE_GROUPS, featureLayout, featureNames, groupColumns, type FeatureSetup } from '../../../src/engine';

const setup = (groups: FeatureSetup['groups'], region?: string): FeatureSetup => ({
  groups, drivers: ['load_forecast', 'wind_forecast'], region, scaleWindow: 28, slots: 24,
  driverStats: { load_forecast: { mean: 0, sd: 1 }, wind_forecast: { mean: 0, sd: 1 } },
});

describe('groupColumns(setup)', () => {
  it('tiles the feature vector: contiguous ranges in featureLayout order, each as long as its names', () => {
    const s = setup([...ALL_FEATURE_GROUPS], 'DE');
    const columns = groupColumns(s);
    const layout = featureLayout(s);
    expect(columns.map((c) => c.group)).toEqual(layout.map((l) => l.group));
    let at = 0;
    columns.forEach((c, k) => { expect(c.from).toBe(at); expect(c.to - c.from).toBe(layout[k].names.length); at = c.to; });
    expect(at).toBe(featureNames(s).length);
  });

  it('leaves out the holidays without a region (they add no column)', () => {
    expect(groupColumns(setup(['price_lags', 'holidays'])).map((c) => c.group)).toEqual(['price_lags']);
  });
});
