import { Option, type Command } from 'commander';
import { ALL_FEATURE_GROUPS, InputError, isFeatureGroup, type FeatureGroup, type ModelOptions } from '../engine';
import { intOption } from './load-input';

/** Flags that shape a learned model, shared by backtest and train. */
export interface ModelFlags {
  seed: string;
  region?: string;
  hidden?: string;
  learningRate?: string;
  momentum?: string;
  iterations?: string;
  ensemble?: string;
  features?: string;
  coverage?: string;
}

export function addModelFlags(cmd: Command): Command {
  return cmd
    .addOption(new Option('--region <code>', 'public-holiday region, e.g. DE or DE-BY (date-holidays codes)'))
    .addOption(new Option('--seed <n>', 'random seed for training').default('1'))
    .option('--hidden <sizes>', 'hidden layer sizes, e.g. 32 or 48,16')
    .option('--learning-rate <lr>', 'back-propagation learning rate, 0 < lr <= 1')
    .option('--momentum <m>', 'momentum, 0 <= m < 1 (a large momentum wants a small learning rate)')
    .option('--iterations <n>', 'most training epochs per network (early stopping may end sooner)')
    .option('--ensemble <n>', 'networks averaged, each from its own seed')
    .option('--features <groups>', `comma-separated feature groups (${ALL_FEATURE_GROUPS.join(', ')}; default: all but price_year_ago)`)
    .option('--coverage <c>', 'nominal coverage of the prediction bands, e.g. 0.9');
}

/** Turns the flags into model options; the model's own schema checks the ranges. */
export function modelOptions(flags: ModelFlags): ModelOptions {
  const options: ModelOptions = { seed: intOption(flags.seed, '--seed', 0, 1) };
  if (flags.region) options.region = flags.region;
  const network: Partial<NonNullable<ModelOptions['network']>> = {};
  if (flags.hidden !== undefined) network.hiddenLayers = flags.hidden.split(',').map((s) => intOption(s.trim(), '--hidden', 1, 1));
  if (flags.learningRate !== undefined) network.learningRate = num(flags.learningRate, '--learning-rate');
  if (flags.momentum !== undefined) network.momentum = num(flags.momentum, '--momentum');
  if (flags.iterations !== undefined) network.iterations = intOption(flags.iterations, '--iterations', 1, 1);
  if (flags.ensemble !== undefined) network.ensemble = intOption(flags.ensemble, '--ensemble', 1, 1);
  if (Object.keys(network).length) options.network = network as ModelOptions['network'];
  if (flags.features !== undefined) {
    const groups = flags.features.split(',').map((s) => s.trim()).filter(Boolean);
    const unknown = groups.filter((g) => !isFeatureGroup(g));
    if (unknown.length) throw new InputError(`--features: unknown group "${unknown[0]}"; choose from ${ALL_FEATURE_GROUPS.join(', ')}`);
    options.groups = groups as FeatureGroup[];
  }
  if (flags.coverage !== undefined) options.coverage = num(flags.coverage, '--coverage');
  return options;
}

function num(text: string, flag: string): number {
  const n = Number(text);
  if (text.trim() === '' || !Number.isFinite(n)) throw new InputError(`${flag} must be a number, got "${text}"`);
  return n;
}
