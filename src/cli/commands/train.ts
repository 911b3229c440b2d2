import { createModel } from '../../engine';
import { intOption } from '../load-input';

export interface TrainFlags {
  input: string;
  until?: string;
  save: string;
  model: string;
  tz: string;
  region?: string;
  seed: string;
  json?: boolean;
}

export async function trainCommand(flags: TrainFlags): Promise<void> {
  createModel(flags.model, { seed: intOption(flags.seed, '--seed', 0, 1), region: flags.region });
}
