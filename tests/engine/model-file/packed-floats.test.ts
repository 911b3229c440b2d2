import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { encodeFloats } from '../../../src/engine/model-file/base64-floats';
import { PACK_BLOCK, packFloats, PackedFloats, unpackFloats } from '../../../src/engine/model-file/packed-floats';

/**
 * packFloats / unpackFloats: block-wise absmax quantisation to 16 bits
 * (each block of 64 values: scale = largest magnitude / 32767, value =
 * round(x / scale) steps). Expected values worked by hand from that
 * definition; the base64 layer is RFC 4648 (base64-floats.test.ts).
 */
describe('packFloats(values) → unpackFloats(text)', () => {
  it('unpackFloats(packFloats([32767, -100, 0.5, 0.49, -2.5])) is [32767, -100, 1, 0, -2]: the step is 1, halves round up', () => {
    expect(Array.from(unpackFloats(packFloats([32767, -100, 0.5, 0.49, -2.5]))!)).toEqual([32767, -100, 1, 0, -2]);
  });

  it('moves no value by more than half a step, 1/65534 of its block\'s largest magnitude', () => {
    const rng = seedrandom('packed');
    const values = Array.from({ length: 1000 }, (_, i) => (rng() - 0.5) * 10 ** ((i % 7) - 3));
    const out = unpackFloats(packFloats(values))!;
    expect(out).toHaveLength(values.length);
    for (let i = 0; i < values.length; i++) {
      const block = values.slice(Math.floor(i / PACK_BLOCK) * PACK_BLOCK, (Math.floor(i / PACK_BLOCK) + 1) * PACK_BLOCK);
      const most = Math.max(...block.map(Math.abs));
      expect(Math.abs(out[i] - values[i])).toBeLessThanOrEqual((most / 65534) * (1 + 1e-6));
    }
  });

  it('keeps zeros, an all-zero block, the empty array and each block\'s largest value (to float32)', () => {
    const values = [...new Array(PACK_BLOCK).fill(0), 3, -7, 0, 1e-9];
    const out = unpackFloats(packFloats(values))!;
    expect(Array.from(out.subarray(0, PACK_BLOCK))).toEqual(new Array(PACK_BLOCK).fill(0));
    expect(Math.abs(out[PACK_BLOCK + 1] + 7)).toBeLessThanOrEqual(7 / 65534);
    expect(out[PACK_BLOCK + 2]).toBe(0);
    expect(Array.from(unpackFloats(packFloats([]))!)).toEqual([]);
  });

  it('is about half the size of float32 base64', () => {
    const values = Array.from({ length: 6400 }, (_, i) => Math.sin(i));
    const ratio = packFloats(values).length / encodeFloats(values, 4).length;
    expect(ratio).toBeGreaterThan(0.5);
    expect(ratio).toBeLessThan(0.53);
  });

  it('packs again to the same text, also from float32 copies (brain.js keeps its weights as float32)', () => {
    const rng = seedrandom('again');
    for (let k = 0; k < 50; k++) {
      const text = packFloats(Array.from({ length: 300 }, () => (rng() * 2 - 1) * 10 ** (k % 5 - 2)));
      expect(packFloats(unpackFloats(text)!)).toBe(text);
      expect(packFloats(Float32Array.from(unpackFloats(text)!))).toBe(text);
    }
  });

  it('refuses a non-finite value to pack, and text that is not a whole packed array', () => {
    expect(() => packFloats([1, NaN])).toThrow(/not a finite number/);
    expect(() => packFloats([Infinity])).toThrow(/not a finite number/);
    const text = packFloats([1, 2, 3]);
    expect(unpackFloats(text.slice(0, -4))).toBeUndefined();
    expect(unpackFloats('')).toBeUndefined();
    expect(unpackFloats('not base64!')).toBeUndefined();
    expect(PackedFloats.safeParse('not base64!').success).toBe(false);
    expect(PackedFloats.safeParse(text).success).toBe(true);
  });
});
