import { baselineModel, BASELINE_KINDS, type BaselineKind } from '../baselines/naive';
import { InputError } from '../errors';
import { Lear } from './lear';
import { Learner } from './learner';
import { DEFAULT_LEARNER_SETTINGS, type LearnerSettings } from './learner-settings';
import type { DayAheadModel } from './model';

export const MODEL_NAMES = ['blend', 'neural', 'linear', 'lear', ...BASELINE_KINDS] as const;
export type ModelName = (typeof MODEL_NAMES)[number];

export type ModelOptions = Partial<Omit<LearnerSettings, 'kind'>>;

/** A fresh, unfitted model by its command-line name. */
export function createModel(name: string, options: ModelOptions = {}): DayAheadModel {
  if ((BASELINE_KINDS as string[]).includes(name)) return baselineModel(name as BaselineKind);
  if (name === 'lear') return new Lear();
  if (name === 'blend' || name === 'neural' || name === 'linear') {
    return new Learner({ ...DEFAULT_LEARNER_SETTINGS, ...options, kind: name, network: { ...DEFAULT_LEARNER_SETTINGS.network, ...options.network } });
  }
  throw new InputError(`unknown model "${name}"; choose one of ${MODEL_NAMES.join(', ')}`);
}
