import { z } from '../schema-config';
import { ALL_FEATURE_GROUPS, type FeatureGroup } from '../features/feature-groups';
import { LearnerSettingsSchema } from '../models/learner-settings';
import { Base64Floats } from './base64-floats';
import { StoredLearSchema } from './lear-file';
import { PackedFloats } from './packed-floats';

/**
 * The stored model, version 3 (version 3 packs the large float arrays to 16
 * bits a value, packed-floats.ts; files of versions 1 and 2 are refused with
 * "train it again"): the one schema of a model saved in a
 * workbook or a file. Its TypeScript type is inferred from it. Objects are
 * strict (unknown keys are refused), names are short plain identifiers (so
 * keys like `__proto__` cannot get in), numbers are finite, and float arrays
 * are base64 text (exact float64 for the standardiser and target range,
 * base64-floats.ts; packed for the rest, `Packed`) whose lengths are checked
 * on load.
 */
export const MODEL_FORMAT = 'spotloom-model';
export const MODEL_VERSION = 3;
export const MAX_MODEL_BYTES = 2 * 1024 * 1024;

const FORBIDDEN = new Set(['__proto__', 'constructor', 'prototype']);
/** A model's or driver's name as a model file keeps it; check driver columns with it before training. */
// real column headers carry units ("load (MW)", "wind [MW]", "temp °C"): allow those, but no
// control characters, quotes or separators that could confuse a message or a file
export const NAME_RULE = 'letters, digits, spaces and _ . - ( ) [ ] % ° # + (at most 64)';
export const StoredName = z.string().min(1).max(64).regex(/^[\p{L}\p{N}_][\p{L}\p{N}_ .\-()[\]%°#+]*$/u, `names may hold ${NAME_RULE}`)
  .refine((s) => !FORBIDDEN.has(s), 'reserved name');
const Name = StoredName;
const Floats = Base64Floats;
const Packed = PackedFloats;
const Finite = z.number().finite();
const Day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);
/** a model's errors on one block of its training days (models/blocks.ts); null where a part is absent */
const BlockScoresSchema = z.strictObject({
  days: z.number().int().min(0), mae: Finite, maeLinear: Finite, maeNeural: Finite.nullable(), maeLear: Finite.nullable().optional(), maeNaiveWeek: Finite.nullable(),
});

export const StoredModelSchema = z.strictObject({
  format: z.literal(MODEL_FORMAT),
  version: z.literal(MODEL_VERSION),
  name: Name,
  createdAt: z.string().max(40).regex(/^\d{4}-\d{2}-\d{2}T[\d:.]+(Z|[+-]\d{2}:\d{2})$/),
  zone: z.string().min(1).max(64).regex(/^[A-Za-z0-9_+\-/]+$/),
  resolution: z.union([z.literal(15), z.literal(30), z.literal(60)]),
  settings: LearnerSettingsSchema.strict(),
  setup: z.strictObject({
    groups: z.array(z.enum(ALL_FEATURE_GROUPS as [FeatureGroup, ...FeatureGroup[]])).max(ALL_FEATURE_GROUPS.length),
    drivers: z.array(Name).max(32),
    driverStats: z.array(z.strictObject({ name: Name, mean: Finite, sd: Finite.positive() })).max(32),
    region: z.string().max(20).optional(),
    scaleWindow: z.number().int().min(7).max(365),
    slots: z.union([z.literal(24), z.literal(48), z.literal(96)]),
  }),
  notes: z.array(z.string().max(300)).max(20),
  standardiser: z.strictObject({ mean: Floats, sd: Floats }),
  linear: z.array(z.strictObject({ window: z.number().int().min(0).max(10_000), lambda: Finite.positive(), weights: Packed })).min(1).max(8),
  networks: z.array(z.strictObject({
    sizes: z.array(z.number().int().min(1).max(4096)).min(3).max(6),
    weights: z.array(Packed).max(6),
    biases: z.array(Packed).max(6),
  })).max(10),
  targetRange: z.strictObject({ lo: Floats, hi: Floats }),
  neuralWeight: Finite.min(0).max(1),
  /** weight of the LEAR part (absent in files saved before the blend had one) */
  learWeight: Finite.min(0).max(1).optional(),
  lear: StoredLearSchema.optional(),
  /** coverages the bands are built at after adaptive updates (models/adaptive-coverage.ts) */
  bandCoverage: z.array(Finite.gt(0).lt(1)).max(8).optional(),
  residuals: z.strictObject({ keep: z.number().int().min(1).max(1000), bySlot: z.array(Packed).max(96) }),
  tuning: BlockScoresSchema,
  holdout: BlockScoresSchema,
  priceRange: z.strictObject({ lo: Finite, hi: Finite }),
  importance: z.array(z.strictObject({ group: z.enum(ALL_FEATURE_GROUPS as [FeatureGroup, ...FeatureGroup[]]), increase: Finite })).max(ALL_FEATURE_GROUPS.length),
  trainedFrom: Day,
  trainedTo: Day,
  residualsThrough: Day,
});

export type StoredModel = z.infer<typeof StoredModelSchema>;
