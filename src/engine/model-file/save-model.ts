import { InputError } from '../errors';
import type { BlockScores, Learner } from '../models/learner';
import type { Resolution } from '../series/series';
import { encodeFloats } from './base64-floats';
import { toStoredLear } from './lear-file';
import { packFloats } from './packed-floats';
import { MAX_MODEL_BYTES, MODEL_FORMAT, MODEL_VERSION, StoredModelSchema, type StoredModel } from './model-schema';

/**
 * A fitted learner as its stored form (model-schema.ts), checked against
 * the schema on the way out too, so nothing unreadable is ever written.
 */
export function toStoredModel(learner: Learner, meta: { name: string; zone: string; resolution: Resolution; createdAt?: string }): StoredModel {
  const state = learner.state;
  if (!state) throw new InputError(`model ${learner.name} has not been trained yet`);
  const f64 = (a: ArrayLike<number>) => encodeFloats(a, 8);
  const stored: StoredModel = {
    format: MODEL_FORMAT,
    version: MODEL_VERSION,
    name: meta.name,
    createdAt: meta.createdAt ?? new Date().toISOString(),
    zone: meta.zone,
    resolution: meta.resolution,
    settings: learner.settings,
    setup: {
      groups: state.setup.groups,
      drivers: state.setup.drivers,
      driverStats: state.setup.drivers.map((name) => ({ name, ...state.setup.driverStats[name] })),
      region: state.setup.region,
      scaleWindow: state.setup.scaleWindow,
      slots: state.setup.slots as 24 | 48 | 96,
    },
    notes: state.notes,
    standardiser: { mean: f64(state.standardiser.mean), sd: f64(state.standardiser.sd) },
    // the large arrays packed to 16 bits a value (packed-floats.ts): forecasts move by less than 1e-4 of the price range
    linear: state.linear.map((l) => ({ window: l.window, lambda: l.lambda, weights: packFloats(l.weights) })),
    networks: state.networks.map((n) => ({
      sizes: n.sizes,
      weights: n.layers.slice(1).map((l) => packFloats(l.weights.flat())),
      biases: n.layers.slice(1).map((l) => packFloats(l.biases)),
    })),
    targetRange: { lo: f64(state.targetRange.lo), hi: f64(state.targetRange.hi) },
    neuralWeight: state.neuralWeight,
    learWeight: state.learWeight,
    ...(state.lear ? { lear: toStoredLear(state.lear) } : {}),
    ...(state.bandCoverage ? { bandCoverage: [...state.bandCoverage] } : {}),
    residuals: { keep: state.residuals.keep, bySlot: state.residuals.bySlot.map((r) => packFloats(r)) },
    tuning: storedScores(state.tuning),
    holdout: storedScores(state.holdout),
    priceRange: { ...state.priceRange },
    importance: state.importance.filter((i) => Number.isFinite(i.increase)),
    trainedFrom: state.trainedFrom,
    trainedTo: state.trainedTo,
    residualsThrough: state.residualsThrough,
  };
  const checked = StoredModelSchema.safeParse(stored);
  if (!checked.success) throw new InputError(`the trained model does not fit the model file format: ${checked.error.issues[0].message}`);
  return stored;
}

function storedScores(v: BlockScores): StoredModel['holdout'] {
  const orNull = (x: number) => (Number.isFinite(x) ? x : null);
  return { ...v, maeNeural: orNull(v.maeNeural), maeLear: orNull(v.maeLear), maeNaiveWeek: orNull(v.maeNaiveWeek) };
}

export function storedModelText(stored: StoredModel): string {
  const text = JSON.stringify(stored);
  if (text.length > MAX_MODEL_BYTES) throw new InputError(`the model is ${Math.round(text.length / 1024)} KB, above the 2 MB limit; use fewer or smaller networks`);
  return text;
}
