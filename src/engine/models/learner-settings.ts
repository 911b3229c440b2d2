import { z } from '../schema-config';
import { ALL_FEATURE_GROUPS, DEFAULT_FEATURE_GROUPS, type FeatureGroup } from '../features/feature-groups';
import { DEFAULT_NETWORK_OPTIONS, NetworkOptionsSchema } from './network-options';

/** Settings of a learned model (blend, neural or linear), as the pane and CLI give them. */
export const LearnerSettingsSchema = z.object({
  kind: z.enum(['blend', 'neural', 'linear']),
  groups: z.array(z.enum(ALL_FEATURE_GROUPS as [FeatureGroup, ...FeatureGroup[]])).min(1, 'choose at least one feature group'),
  region: z.string().max(20).optional(),
  seed: z.number().int().min(0).max(2 ** 31),
  network: NetworkOptionsSchema,
  /** days of prices behind each day's level scale (npm run bench: 56 scored best on average over 14, 28, 56 and 112) */
  scaleWindow: z.number().int().min(7, 'the scaling window needs at least 7 days').max(365),
  /** days at the end of the training span held out for validation; 0 = automatic */
  validationDays: z.number().int().min(0).max(730),
  /** nominal coverage of the bands */
  coverage: z.number().gt(0.5, 'band coverage must be above 0.5').lt(1, 'band coverage must be below 1'),
  /** epochs of warm-start training per network at each update */
  warmEpochs: z.number().int().min(0).max(1000),
});

export type LearnerSettings = z.infer<typeof LearnerSettingsSchema>;

export const DEFAULT_LEARNER_SETTINGS: LearnerSettings = {
  kind: 'blend',
  groups: [...DEFAULT_FEATURE_GROUPS],
  seed: 1,
  network: DEFAULT_NETWORK_OPTIONS,
  scaleWindow: 56,
  validationDays: 0,
  coverage: 0.9,
  warmEpochs: 2,
};

/** Penalties tried for the linear model, scaled per row (ridge.ts). */
export const RIDGE_LAMBDAS = [1e-4, 3e-4, 1e-3, 3e-3, 1e-2, 3e-2, 0.1, 0.3, 1, 3];
