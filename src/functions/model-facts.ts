import { InputError, type StoredModel } from '../engine';
import { isOmitted, textArg } from './cells';

/**
 * LOOM.MODEL: facts about a stored model. Without a field, a two-column
 * table of every fact (name, value); with one, that fact alone. Dates are
 * text (YYYY-MM-DD), so they read the same in every workbook.
 *
 * @example modelFacts(stored, 'validation_mae') // [[4.21]]
 *
 * `validation_*` are the holdout block's scores: days at the end of the
 * training span that took part in no choice (models/blocks.ts); `tuning_*`
 * are the scores on the block the choices were made on, in-sample for them.
 */
export const MODEL_FIELDS = [
  'name', 'kind', 'trained_range', 'trained_from', 'trained_to', 'resolution', 'zone', 'features', 'drivers', 'region',
  'validation_days', 'validation_mae', 'validation_mae_linear', 'validation_mae_neural', 'validation_mae_lear', 'validation_mae_naive_week',
  'tuning_days', 'tuning_mae',
  'neural_weight', 'lear_weight', 'coverage', 'networks', 'hidden_layers', 'created',
] as const;

type Field = (typeof MODEL_FIELDS)[number];

export function modelFacts(stored: StoredModel, field: unknown): (string | number)[][] {
  const facts = factsOf(stored);
  if (isOmitted(field)) return MODEL_FIELDS.map((f) => [f, facts[f]]);
  const key = textArg(field, 'field', '').toLowerCase().replace(/[\s-]+/g, '_') as Field;
  if (!(MODEL_FIELDS as readonly string[]).includes(key)) {
    throw new InputError(`"${textArg(field, 'field', '')}" is not a model fact; use one of ${MODEL_FIELDS.join(', ')}`);
  }
  return [[facts[key]]];
}

function factsOf(m: StoredModel): Record<Field, string | number> {
  const v = m.holdout;
  const num = (x: number | null) => (x === null || !Number.isFinite(x) ? '' : x);
  return {
    name: m.name,
    kind: m.settings.kind,
    trained_range: `${m.trainedFrom} to ${m.trainedTo}`,
    trained_from: m.trainedFrom,
    trained_to: m.trainedTo,
    resolution: m.resolution,
    zone: m.zone,
    features: m.setup.groups.join(', '),
    drivers: m.setup.drivers.join(', '),
    region: m.setup.region ?? '',
    validation_days: v.days,
    validation_mae: num(v.mae),
    validation_mae_linear: num(v.maeLinear),
    validation_mae_neural: num(v.maeNeural),
    validation_mae_lear: num(v.maeLear ?? null),
    validation_mae_naive_week: num(v.maeNaiveWeek),
    tuning_days: m.tuning.days,
    tuning_mae: num(m.tuning.mae),
    neural_weight: m.neuralWeight,
    lear_weight: m.learWeight ?? 0,
    coverage: m.settings.coverage,
    networks: m.networks.length,
    hidden_layers: m.settings.kind === 'linear' ? '' : m.settings.network.hiddenLayers.join(', '),
    created: m.createdAt,
  };
}
