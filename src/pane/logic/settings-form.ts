import {
  DEFAULT_LEARNER_SETTINGS, DEFAULT_NETWORK_OPTIONS, FEATURE_GROUPS, LearnerSettingsSchema, NetworkOptionsSchema,
  type FeatureGroup, type LearnerSettings, type NetworkOptions,
} from '../../engine';

/** The Train form as typed: every field is text until checked. */
export interface TrainForm {
  kind: string;
  groups: string[];
  hiddenLayers: string;
  learningRate: string;
  momentum: string;
  iterations: string;
  ensemble: string;
  coverage: string;
  region: string;
  seed: string;
}

export type FormField = keyof TrainForm;

export interface FieldHelp {
  field: FormField;
  label: string;
  /** one plain line saying what the setting does */
  help: string;
}

/** The one-line explanations shown under each setting. */
export const FIELD_HELP: FieldHelp[] = [
  { field: 'kind', label: 'Model', help: 'Blend mixes the neural networks with the linear model, weighted by how each did on the most recent weeks; neural or linear uses one alone.' },
  { field: 'groups', label: 'Inputs', help: 'What the model may look at. Fewer inputs train faster; inputs the data cannot supply are left out with a note.' },
  { field: 'hiddenLayers', label: 'Hidden layers', help: 'Neurons per hidden layer, e.g. 32 or 48,16. Bigger layers can learn more shapes but need more history and time.' },
  { field: 'learningRate', label: 'Learning rate', help: 'How big each training step is. Too large and the loss jumps around; too small and training crawls.' },
  { field: 'momentum', label: 'Momentum', help: 'How much of the previous step carries into the next. A large momentum usually wants a smaller learning rate.' },
  { field: 'iterations', label: 'Iterations', help: 'The most passes over the training days per network; training stops earlier once the validation error stops improving.' },
  { field: 'ensemble', label: 'Ensemble size', help: 'Networks trained from different random starts and averaged; more is steadier but takes longer.' },
  { field: 'coverage', label: 'Band coverage', help: 'Share of actual prices the band should hold, e.g. 0.9 for a band from the 5 % to the 95 % error.' },
  { field: 'seed', label: 'Seed', help: 'Random start of training; the same data and seed give the same model.' },
];

/** The form filled with the engine's defaults. */
export function defaultForm(region = ''): TrainForm {
  const n = DEFAULT_NETWORK_OPTIONS;
  return {
    kind: DEFAULT_LEARNER_SETTINGS.kind,
    groups: [...DEFAULT_LEARNER_SETTINGS.groups],
    hiddenLayers: n.hiddenLayers.join(','),
    learningRate: String(n.learningRate),
    momentum: String(n.momentum),
    iterations: String(n.iterations),
    ensemble: String(n.ensemble),
    coverage: String(DEFAULT_LEARNER_SETTINGS.coverage),
    region,
    seed: String(DEFAULT_LEARNER_SETTINGS.seed),
  };
}

export type FormResult =
  | { ok: true; settings: LearnerSettings; warnings: string[] }
  | { ok: false; errors: { field: FormField; message: string }[] };

const NETWORK_FIELDS: Partial<Record<keyof NetworkOptions, FormField>> = {
  hiddenLayers: 'hiddenLayers', learningRate: 'learningRate', momentum: 'momentum', iterations: 'iterations', ensemble: 'ensemble',
};

/**
 * Checks the form through the engine's own schemas (NetworkOptionsSchema,
 * LearnerSettingsSchema), so the pane and the command line refuse the same
 * things with the same words. Text that is not a number is refused first.
 * Warnings are advice, not errors: a large momentum with a large learning
 * rate (the effective step is about lr / (1 − momentum), common practice).
 */
export function readTrainForm(form: TrainForm): FormResult {
  const errors: { field: FormField; message: string }[] = [];
  const number = (field: FormField, text: string): number => {
    const t = text.trim();
    const n = Number(t);
    if (t === '' || !Number.isFinite(n)) { errors.push({ field, message: `${label(field)}: "${text}" is not a number` }); return NaN; }
    return n;
  };
  const parts = form.hiddenLayers.split(',').map((s) => s.trim()).filter((s) => s !== '');
  const hiddenLayers = parts.map((p) => number('hiddenLayers', p));
  const network = {
    ...DEFAULT_NETWORK_OPTIONS,
    hiddenLayers,
    learningRate: number('learningRate', form.learningRate),
    momentum: number('momentum', form.momentum),
    iterations: number('iterations', form.iterations),
    ensemble: number('ensemble', form.ensemble),
  };
  const coverage = number('coverage', form.coverage);
  const seed = number('seed', form.seed);
  if (errors.length) return { ok: false, errors };

  const net = NetworkOptionsSchema.safeParse(network);
  if (!net.success) {
    for (const issue of net.error.issues) {
      const field = NETWORK_FIELDS[issue.path[0] as keyof NetworkOptions] ?? 'hiddenLayers';
      errors.push({ field, message: `${label(field)}: ${issue.message}` });
    }
    return { ok: false, errors };
  }
  const candidate = {
    ...DEFAULT_LEARNER_SETTINGS,
    kind: form.kind,
    groups: form.groups,
    network: net.data,
    coverage,
    seed,
    ...(form.region.trim() ? { region: form.region.trim() } : {}),
  };
  const checked = LearnerSettingsSchema.safeParse(candidate);
  if (!checked.success) {
    for (const issue of checked.error.issues) {
      const key = String(issue.path[0]);
      const field: FormField = key === 'groups' ? 'groups' : key === 'coverage' ? 'coverage' : key === 'seed' ? 'seed' : key === 'region' ? 'region' : 'kind';
      errors.push({ field, message: `${label(field)}: ${issue.message}` });
    }
    return { ok: false, errors };
  }
  const warnings: string[] = [];
  const s = checked.data;
  const step = s.network.learningRate / (1 - s.network.momentum);
  if (s.kind !== 'linear' && s.network.momentum >= 0.8 && step > 0.2) {
    warnings.push(`momentum ${s.network.momentum} with learning rate ${s.network.learningRate} makes an effective step of about ${step.toFixed(2)}; if the validation loss jumps around, lower the learning rate`);
  }
  if (s.kind === 'linear') warnings.push('the linear model trains no networks, so hidden layers, learning rate, momentum, iterations and ensemble size are not used');
  return { ok: true, settings: s, warnings };
}

/** The label of a feature group for the checkbox list. */
export function groupLabel(id: FeatureGroup): string {
  return FEATURE_GROUPS.find((g) => g.id === id)?.label ?? id;
}

function label(field: FormField): string {
  if (field === 'region') return 'Holiday region';
  return FIELD_HELP.find((h) => h.field === field)?.label ?? field;
}
