import seedrandom from 'seedrandom';
import { featureLayout, type FeatureSetup } from '../features/day-features';
import type { FeatureGroup } from '../features/feature-groups';
import type { TrainingDay } from './training-days';

export interface GroupImportance {
  group: FeatureGroup;
  /** rise of the MAE when the group's inputs are shuffled across days */
  increase: number;
}

/**
 * Permutation importance (Breiman 2001; Fisher, Rudin & Dominici 2019):
 * each group's columns are shuffled together across the given days and the
 * rise in MAE is recorded. Seeded, so it repeats exactly. Largest first.
 */
export function permutationImportance(
  setup: FeatureSetup, days: TrainingDay[], seed: number,
  predict: (x: Float64Array, d: TrainingDay) => Float64Array, score: (preds: Float64Array[]) => number,
): GroupImportance[] {
  const rng = seedrandom(`spotloom-importance-${seed}`);
  const base = score(days.map((d) => predict(d.x, d)));
  const out: GroupImportance[] = [];
  let start = 0;
  for (const { group, names } of featureLayout(setup)) {
    const cols = names.length;
    const order = days.map((_, i) => i);
    for (let i = order.length - 1; i > 0; i--) { const j = Math.floor(rng() * (i + 1)); [order[i], order[j]] = [order[j], order[i]]; }
    const preds = days.map((d, i) => {
      const x = Float64Array.from(d.x);
      x.set(days[order[i]].x.subarray(start, start + cols), start);
      return predict(x, d);
    });
    out.push({ group, increase: score(preds) - base });
    start += cols;
  }
  return out.sort((a, b) => b.increase - a.increase);
}
