import { InputError } from '../errors';
import { featureNames } from '../features/day-features';
import { Learner, type LearnerState } from '../models/learner';
import type { NetworkJson } from '../models/network';
import { decodeFloats } from './base64-floats';
import { fromStoredLear } from './lear-file';
import { REPORTED_COVERAGES } from '../models/bands';
import { unpackFloats } from './packed-floats';
import { MAX_MODEL_BYTES, MODEL_FORMAT, MODEL_VERSION, StoredModelSchema, type StoredModel } from './model-schema';

/**
 * Reads a stored model from untrusted text (a workbook or a file): size
 * cap first, then JSON, then the schema, then every array's length against
 * the shapes it claims. Anything that does not match is refused.
 *
 * @throws InputError naming what is wrong
 */
export function parseStoredModel(text: string, source = 'the model'): StoredModel {
  if (typeof text !== 'string' || text.length === 0) throw new InputError(`${source} is empty`);
  if (text.length > MAX_MODEL_BYTES) throw new InputError(`${source} is larger than the 2 MB limit for a model`);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new InputError(`${source} is not JSON`);
  }
  const version = (json as { format?: unknown; version?: unknown } | null)?.version;
  if ((json as { format?: unknown } | null)?.format === MODEL_FORMAT && typeof version === 'number' && version < MODEL_VERSION) {
    // version 1 reported its tuning-block error as its validation error and has no price range to guard inputs with;
    // version 2 kept its weights as float32, version 3 packs them (packed-floats.ts)
    throw new InputError(`${source} was saved by an earlier Spotloom (model file version ${version}); train it again to use it`);
  }
  const checked = StoredModelSchema.safeParse(json);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    throw new InputError(`${source} is not a valid Spotloom model: ${issue.path.join('.') || 'top level'}: ${issue.message}`);
  }
  return checked.data;
}

/** A ready learner from a parsed stored model. */
export function learnerFromStored(stored: StoredModel, source = 'the model'): Learner {
  const bad = (what: string): never => { throw new InputError(`${source} is not a valid Spotloom model: ${what}`); };
  const p = featureCount(stored);
  const m = stored.setup.slots;
  const floats = (text: string, bytes: 4 | 8 | 'packed', length: number, what: string) => {
    const v = bytes === 'packed' ? unpackFloats(text) : decodeFloats(text, bytes);
    if (!v && bytes === 'packed') return bad(`${what} is not a packed float array (a wrong length, or a scale that is not a finite number)`);
    if (!v || v.length !== length) return bad(`${what} has the wrong size`);
    if (!v.every(Number.isFinite)) return bad(`${what} holds a value that is not a finite number`);
    return v;
  };
  // training keeps every standard deviation above 1e-9 (standardiser.ts); a smaller one divides by (almost) zero
  const positive = (v: Float64Array, what: string) => (v.every((x) => x > 1e-9) ? v : bad(`${what} holds a value of 1e-9 or less`));
  if (stored.setup.drivers.length !== stored.setup.driverStats.length || stored.setup.driverStats.some((d, i) => d.name !== stored.setup.drivers[i])) {
    bad('setup.driverStats does not match setup.drivers');
  }
  if (stored.residuals.bySlot.length !== m) bad('residuals has the wrong number of slots');
  if (stored.settings.kind !== 'linear' && stored.networks.length === 0) bad(`a ${stored.settings.kind} model needs networks`);
  const networks: NetworkJson[] = stored.networks.map((n, k) => {
    if (n.sizes[0] !== p || n.sizes[n.sizes.length - 1] !== m) bad(`network ${k + 1} does not fit the features`);
    if (n.weights.length !== n.sizes.length - 1 || n.biases.length !== n.sizes.length - 1) bad(`network ${k + 1} has the wrong number of layers`);
    const layers: NetworkJson['layers'] = [{ weights: [], biases: [] }];
    for (let l = 1; l < n.sizes.length; l++) {
      const rows = n.sizes[l], cols = n.sizes[l - 1];
      const w = floats(n.weights[l - 1], 'packed', rows * cols, `network ${k + 1} layer ${l} weights`);
      const weights = Array.from({ length: rows }, (_, r) => Array.from(w.subarray(r * cols, (r + 1) * cols)));
      layers.push({ weights, biases: Array.from(floats(n.biases[l - 1], 'packed', rows, `network ${k + 1} layer ${l} biases`)) });
    }
    return { sizes: [...n.sizes], layers };
  });
  const lear = () => {
    if (!stored.lear) return undefined;
    const cal = fromStoredLear(stored.lear, m, stored.setup.drivers);
    return typeof cal === 'string' ? bad(cal) : cal;
  };
  if ((stored.neuralWeight + (stored.learWeight ?? 0)) > 1 + 1e-9) bad('the blend weights add up to more than 1');
  if (stored.bandCoverage && stored.bandCoverage.length !== 1 + REPORTED_COVERAGES.length) bad('bandCoverage has the wrong number of levels');
  const driverStats: LearnerState['setup']['driverStats'] = Object.create(null);
  for (const d of stored.setup.driverStats) driverStats[d.name] = { mean: d.mean, sd: d.sd };
  const state: LearnerState = {
    setup: { ...stored.setup, driverStats },
    notes: stored.notes,
    standardiser: { mean: floats(stored.standardiser.mean, 8, p, 'standardiser.mean'), sd: positive(floats(stored.standardiser.sd, 8, p, 'standardiser.sd'), 'standardiser.sd') },
    linear: stored.linear.map((l, k) => ({ window: l.window, lambda: l.lambda, weights: floats(l.weights, 'packed', (p + 1) * m, `linear.${k}.weights`) })),
    networks,
    targetRange: { lo: floats(stored.targetRange.lo, 8, m, 'targetRange.lo'), hi: floats(stored.targetRange.hi, 8, m, 'targetRange.hi') },
    neuralWeight: stored.neuralWeight,
    learWeight: stored.learWeight ?? 0,
    lear: lear(),
    bandCoverage: stored.bandCoverage ? [...stored.bandCoverage] : undefined,
    residuals: {
      keep: stored.residuals.keep,
      bySlot: stored.residuals.bySlot.map((r, k) => {
        const v = unpackFloats(r);
        if (!v || v.length > stored.residuals.keep || !v.every(Number.isFinite)) return bad(`residuals of slot ${k + 1} are not valid`);
        return Array.from(v);
      }),
    },
    tuning: loadedScores(stored.tuning),
    holdout: loadedScores(stored.holdout),
    priceRange: stored.priceRange.lo <= stored.priceRange.hi ? { ...stored.priceRange } : bad('priceRange has its lowest price above its highest'),
    importance: stored.importance,
    trainedFrom: stored.trainedFrom,
    trainedTo: stored.trainedTo,
    residualsThrough: stored.residualsThrough,
  };
  return new Learner(stored.settings, state);
}

function loadedScores(v: StoredModel['holdout']): LearnerState['holdout'] {
  return { ...v, maeNeural: v.maeNeural ?? NaN, maeLear: v.maeLear ?? NaN, maeNaiveWeek: v.maeNaiveWeek ?? NaN };
}

function featureCount(stored: StoredModel): number {
  return featureNames({ ...stored.setup, driverStats: {} }).length;
}
