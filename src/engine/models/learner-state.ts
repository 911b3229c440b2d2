import type { FeatureSetup } from '../features/day-features';
import type { ResidualPool } from './bands';
import type { LearCalibration } from './lear-calibrate';
import type { LinearMember } from './linear-ensemble';
import type { NetworkJson } from './network';
import type { GroupImportance } from './permutation-importance';
import type { PriceRange } from './price-range';
import type { Standardiser } from './standardiser';
import type { UnitRange } from './unit-range';

/** Errors of a model on one block of days (blocks.ts). */
export interface BlockScores {
  days: number;
  mae: number;
  maeLinear: number;
  maeNeural: number;
  /** LEAR's error where the blend has a LEAR part (NaN otherwise) */
  maeLear: number;
  maeNaiveWeek: number;
}

/** What a fitted learner knows; model-file/ stores exactly this. */
export interface LearnerState {
  setup: FeatureSetup;
  notes: string[];
  standardiser: Standardiser;
  /** ridge models on several calibration windows (linear-ensemble.ts) */
  linear: LinearMember[];
  networks: NetworkJson[];
  /** map of the networks' targets into the sigmoid's (0, 1) (unit-range.ts) */
  targetRange: UnitRange;
  /** weight of the network ensemble in the blend (1 = neural only, 0 = linear only) */
  neuralWeight: number;
  /** weight of LEAR in the blend; the linear part has 1 - neuralWeight - learWeight */
  learWeight: number;
  /** LEAR's newest calibration, where learWeight > 0 */
  lear?: LearCalibration;
  residuals: ResidualPool;
  /** the coverage each band is built at after adaptive conformal updates (adaptive-coverage.ts), in the order [own, ...REPORTED_COVERAGES]; absent = nominal */
  bandCoverage?: number[];
  /** scores on the block every choice was made on: in-sample for those choices */
  tuning: BlockScores;
  /** scores on the newest training days, which took part in no choice */
  holdout: BlockScores;
  /** rise of the holdout MAE when a group's inputs are shuffled */
  importance: GroupImportance[];
  /** lowest and highest price learnt from (price-range.ts) */
  priceRange: PriceRange;
  trainedFrom: string;
  /** last delivery day whose prices the model has learnt from */
  trainedTo: string;
  /** newest delivery day whose forecast error is in the band pool */
  residualsThrough: string;
}
