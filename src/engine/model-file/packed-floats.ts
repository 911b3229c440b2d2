import { z } from '../schema-config';
import { BASE64, decodeBytes, encodeBytes } from './base64-floats';

/**
 * Float arrays packed to 16 bits a value, for the large parts of a model
 * file (ridge coefficients, network weights, recent errors): half the size
 * of float32. Blocks of 64 values share one float32 scale, the block's
 * largest magnitude over 32767; each value is a signed 16-bit multiple of
 * it, so a value moves by at most half a step, 1/65534 of its block's
 * largest magnitude (block-wise absmax quantisation, common practice for
 * storing network weights). Every packed value is finite by construction.
 *
 * Layout, little-endian, as base64 text (RFC 4648 §4): uint32 count, then
 * ceil(count / 64) float32 scales, then count int16 steps.
 *
 * tests/engine/model-file/model-file.test.ts checks that a model's forecasts
 * move by less than 1e-4 of its price range through a save and a load.
 *
 * @example unpackFloats(packFloats([32767, -100, 0.5]))  // [32767, -100, 1]: one step is 1 here
 */
export const PACK_BLOCK = 64;
const STEPS = 32767;
/** the model file's own cap (2 MB, model-schema.ts); no packed text can be longer */
const MAX_CHARS = 2 * 1024 * 1024;

/** The schema piece of a packed array (its length is checked when unpacked). */
export const PackedFloats = z.string().max(MAX_CHARS).regex(BASE64, 'not base64 text');

/** @throws Error when a value is not finite (a trained model never holds one) */
export function packFloats(values: ArrayLike<number>): string {
  const n = values.length;
  const blocks = Math.ceil(n / PACK_BLOCK);
  const buf = new ArrayBuffer(4 + 4 * blocks + 2 * n);
  const view = new DataView(buf);
  view.setUint32(0, n, true);
  for (let b = 0; b < blocks; b++) {
    let most = 0;
    for (let i = b * PACK_BLOCK; i < Math.min(n, (b + 1) * PACK_BLOCK); i++) {
      if (!Number.isFinite(values[i])) throw new Error(`packFloats: value ${i} is not a finite number`);
      most = Math.max(most, Math.abs(values[i]));
    }
    const scale = Math.fround(most / STEPS);
    view.setFloat32(4 + 4 * b, scale, true);
    for (let i = b * PACK_BLOCK; i < Math.min(n, (b + 1) * PACK_BLOCK); i++) {
      // the float32 scale may round down a hair: clamp, so the largest value never wraps past 32767 steps
      const steps = scale > 0 ? Math.max(-STEPS, Math.min(STEPS, Math.round(values[i] / scale))) : 0;
      view.setInt16(4 + 4 * blocks + 2 * i, steps, true);
    }
  }
  return encodeBytes(new Uint8Array(buf));
}

/** @returns the values, or undefined when the text is not a whole packed array */
export function unpackFloats(text: string): Float64Array | undefined {
  const raw = decodeBytes(text);
  if (!raw || raw.length < 4) return undefined;
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  const n = view.getUint32(0, true);
  const blocks = Math.ceil(n / PACK_BLOCK);
  if (raw.length !== 4 + 4 * blocks + 2 * n) return undefined;
  const out = new Float64Array(n);
  for (let b = 0; b < blocks; b++) {
    const scale = view.getFloat32(4 + 4 * b, true);
    if (!Number.isFinite(scale) || scale < 0) return undefined;
    for (let i = b * PACK_BLOCK; i < Math.min(n, (b + 1) * PACK_BLOCK); i++) out[i] = view.getInt16(4 + 4 * blocks + 2 * i, true) * scale;
  }
  return out;
}
