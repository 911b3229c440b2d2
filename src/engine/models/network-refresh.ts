import type { LearnerSettings } from './learner-settings';
import { trainNetwork, type NetworkJson, type Sample } from './network';
import { standardise, type Standardiser } from './standardiser';
import type { TrainingDay } from './training-days';
import { toUnit, type UnitRange } from './unit-range';

/** Training pairs for the networks: standardised features, targets mapped into (0, 1). */
export function networkSamples(days: TrainingDay[], standardiser: Standardiser, range: UnitRange): Sample[] {
  return days.map((d) => ({ input: standardise(d.x, standardiser), output: toUnit(d.y!, range) }));
}

/**
 * A warm start: each network goes on from its weights for `warmEpochs`
 * epochs over the samples and keeps the weights it ends with (there is no
 * block left to judge by, so no best-weights selection). The seed follows
 * the day, so the same data gives the same networks.
 */
export function refreshNetworks(networks: NetworkJson[], samples: Sample[], s: LearnerSettings, day: number): NetworkJson[] {
  const warm = { ...s.network, iterations: s.warmEpochs };
  return networks.map((json, k) => trainNetwork(samples, warm, s.seed * 101 + k + day * 7919, undefined, undefined, json).json);
}
