import { describe, expect, it } from 'vitest';
import { ALL_FEATURE_GROUPS, FEATURE_GROUPS, isFeatureGroup } from '../../../src/engine';

describe('FEATURE_GROUPS', () => {
  it('has unique ids with a label each, in the order of ALL_FEATURE_GROUPS', () => {
    const ids = FEATURE_GROUPS.map((g) => g.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ALL_FEATURE_GROUPS).toEqual(ids);
    for (const g of FEATURE_GROUPS) expect(g.label.length).toBeGreaterThan(10);
  });
});

describe('isFeatureGroup(id)', () => {
  it('accepts every group id and nothing else', () => {
    for (const id of ALL_FEATURE_GROUPS) expect(isFeatureGroup(id)).toBe(true);
    for (const id of ['', 'Price_Lags', 'price_lags ', 'label', 'toString', 'constructor']) expect(isFeatureGroup(id)).toBe(false);
  });
});
