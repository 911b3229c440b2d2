import { featureLayout, type FeatureSetup } from './day-features';
import type { FeatureGroup } from './feature-groups';

/** The columns of one feature group inside a feature vector: `from` … `to` - 1. */
export interface GroupColumns {
  group: FeatureGroup;
  from: number;
  to: number;
}

/**
 * Which columns of a feature vector (dayFeatures) belong to which group, in
 * vector order. Groups that add no column (holidays without a region,
 * residual load without both load and renewables) are left out, as in
 * featureLayout.
 *
 * @example groupColumns(setup) // [{ group: 'price_lags', from: 0, to: 96 }, { group: 'price_d1_stats', from: 96, to: 99 }, ...]
 */
export function groupColumns(setup: FeatureSetup): GroupColumns[] {
  let at = 0;
  return featureLayout(setup).map(({ group, names }) => {
    const from = at;
    at += names.length;
    return { group, from, to: at };
  });
}
