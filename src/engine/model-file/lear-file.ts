import { z } from '../schema-config';
import { LEAR_LEVELS, learDesign, type LearLevel } from '../models/lear-features';
import type { LearCalibration } from '../models/lear-calibrate';
import { Base64Floats, decodeFloats, encodeFloats } from './base64-floats';

/**
 * The blend's LEAR part as a model file keeps it: the input level (the
 * design is rebuilt from it, the slots and the drivers), each input's scale,
 * and per period only the non-zero coefficients with their positions, since
 * the lasso leaves most of them at zero. Coefficients are stored as 32-bit
 * floats (a relative change below 1e-7, far inside the model file's budget
 * of 1e-4 of the price range), the input scales in 8 bytes.
 */
const Floats = Base64Floats;
const Finite = z.number().finite();

export const StoredLearSchema = z.strictObject({
  level: z.enum(LEAR_LEVELS as unknown as [LearLevel, ...LearLevel[]]),
  /** centre and scale of each design input, interleaved */
  inputScales: Floats,
  periods: z.array(z.strictObject({
    intercept: Finite, alpha: Finite, centre: Finite, scale: Finite.positive(),
    /** positions (in the period's inputs) of the non-zero coefficients, and their values */
    at: Floats, coef: Floats,
  })).min(1).max(96),
  days: z.number().int().min(1).max(100_000),
  from: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  to: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  note: z.string().max(300).optional(),
});

export type StoredLear = z.infer<typeof StoredLearSchema>;

export function toStoredLear(cal: LearCalibration): StoredLear {
  return {
    level: cal.design.level,
    inputScales: encodeFloats(cal.inputScales.flatMap((s) => [s.centre, s.scale]), 8),
    periods: cal.periods.map((p) => {
      const at: number[] = [], coef: number[] = [];
      p.coef.forEach((c, k) => { if (c !== 0) { at.push(k); coef.push(c); } });
      return { intercept: p.intercept, alpha: p.alpha, centre: p.target.centre, scale: p.target.scale, at: encodeFloats(at, 4), coef: encodeFloats(coef, 4) };
    }),
    days: cal.days, from: cal.from, to: cal.to, ...(cal.note ? { note: cal.note } : {}),
  };
}

/** The calibration back, or a message saying what does not fit. */
export function fromStoredLear(stored: StoredLear, slots: number, drivers: string[]): LearCalibration | string {
  const design = learDesign(stored.level, slots, drivers);
  if (stored.periods.length !== slots) return 'lear has the wrong number of periods';
  const scales = decodeFloats(stored.inputScales, 8);
  if (!scales || scales.length !== 2 * design.inputs.length || !scales.every(Number.isFinite)) return 'lear.inputScales has the wrong size';
  const inputScales = design.inputs.map((_, u) => ({ centre: scales[2 * u], scale: scales[2 * u + 1] }));
  if (inputScales.some((s) => !(s.scale > 0))) return 'lear.inputScales holds a scale of 0 or less';
  const periods: LearCalibration['periods'] = [];
  for (let h = 0; h < slots; h++) {
    const p = stored.periods[h];
    const inputs = design.byPeriod[h];
    const at = decodeFloats(p.at, 4), values = decodeFloats(p.coef, 4);
    if (!at || !values || at.length !== values.length || !values.every(Number.isFinite)) return `lear period ${h + 1} is not valid`;
    const coef = new Float64Array(inputs.length);
    for (let i = 0; i < at.length; i++) {
      const k = at[i];
      if (!Number.isInteger(k) || k < 0 || k >= inputs.length) return `lear period ${h + 1} names an input that does not exist`;
      coef[k] = values[i];
    }
    periods.push({ inputs, coef, intercept: p.intercept, alpha: p.alpha, selected: at.length, target: { centre: p.centre, scale: p.scale } });
  }
  return { design, drivers, inputScales, periods, days: stored.days, from: stored.from, to: stored.to, note: stored.note };
}
