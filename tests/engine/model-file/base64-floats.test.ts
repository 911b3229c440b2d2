import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { BASE64, decodeFloats, encodeFloats } from '../../../src/engine/model-file/base64-floats';

/** The float32 (or float64) values whose little-endian bytes are `bytes`, so byte test vectors can go through the float API. */
function floatsOfBytes(bytes: Uint8Array, size: 4 | 8): number[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return Array.from({ length: bytes.length / size }, (_, i) => (size === 4 ? view.getFloat32(i * 4, true) : view.getFloat64(i * 8, true)));
}
const ascii = (text: string) => Uint8Array.from(text, (c) => c.charCodeAt(0));

describe('encodeFloats(values, bytes) uses the base64 alphabet of RFC 4648', () => {
  it('gives the RFC 4648 §10 test vectors "" → "" and "foob" → "Zm9vYg=="', () => {
    // RFC 4648 §10: BASE64("") = "", BASE64("foob") = "Zm9vYg==" (4 bytes: one float32)
    expect(encodeFloats([], 4)).toBe('');
    expect(encodeFloats(floatsOfBytes(ascii('foob'), 4), 4)).toBe('Zm9vYg==');
  });

  it('gives "foobar" + two bytes as RFC 4648 §10 "Zm9vYmFy" followed by the padded rest', () => {
    // RFC 4648 §10: BASE64("foobar") = "Zm9vYmFy"; BASE64("fo") = "Zm8=", so "foobarfo" = "Zm9vYmFyZm8="
    expect(encodeFloats(floatsOfBytes(ascii('foobarfo'), 8), 8)).toBe('Zm9vYmFyZm8=');
    expect(encodeFloats(floatsOfBytes(ascii('foobarfoobar'), 4), 4)).toBe('Zm9vYmFyZm9vYmFy');
  });

  it('matches Node Buffer base64 (RFC 4648 §4) on random bytes of every length class, + and / included', () => {
    // reference: Node.js Buffer.toString('base64'), a general-purpose RFC 4648 implementation
    const rng = seedrandom('b64');
    let sawPlus = false, sawSlash = false;
    for (let n = 1; n <= 40; n++) {
      const bytes = Uint8Array.from({ length: n * 4 }, () => Math.floor(rng() * 256));
      const floats = floatsOfBytes(bytes, 4);
      if (floats.some(Number.isNaN)) continue; // NaN payloads need not survive a JS number
      const text = encodeFloats(floats, 4);
      expect(text).toBe(Buffer.from(bytes).toString('base64'));
      expect(text).toMatch(BASE64);
      sawPlus ||= text.includes('+'); sawSlash ||= text.includes('/');
    }
    expect(sawPlus && sawSlash).toBe(true);
  });
});

describe('decodeFloats(text, bytes)', () => {
  it('reads the RFC 4648 §10 vectors back', () => {
    expect(Array.from(decodeFloats('', 4)!)).toEqual([]);
    expect(Array.from(decodeFloats('Zm9vYg==', 4)!)).toEqual(floatsOfBytes(ascii('foob'), 4));
    expect(Array.from(decodeFloats('Zm9vYmFyZm8=', 8)!)).toEqual(floatsOfBytes(ascii('foobarfo'), 8));
  });

  it('round-trips float64 exactly, -0, infinities, subnormals and extremes included', () => {
    const rng = seedrandom('f64');
    const values = [0, -0, 1, -1, Math.PI, 1 / 3, Number.MAX_VALUE, -Number.MAX_VALUE, Number.MIN_VALUE, 2.2250738585072014e-308, Infinity, -Infinity, 0.1 + 0.2,
      ...Array.from({ length: 200 }, () => (rng() - 0.5) * 10 ** Math.floor(rng() * 40 - 20))];
    const back = decodeFloats(encodeFloats(values, 8), 8)!;
    expect(back).toHaveLength(values.length);
    values.forEach((v, i) => expect(Object.is(back[i], v)).toBe(true));
    expect(decodeFloats(encodeFloats([NaN], 8), 8)![0]).toBeNaN();
  });

  it('round-trips float32 values (Math.fround) exactly and rounds others to float32', () => {
    const rng = seedrandom('f32');
    const values = [-0, 1.5, 3.4028234663852886e38, 1.401298464324817e-45, -Infinity, ...Array.from({ length: 200 }, () => Math.fround((rng() - 0.5) * 1e6))];
    const back = decodeFloats(encodeFloats(values, 4), 4)!;
    values.forEach((v, i) => expect(Object.is(back[i], v)).toBe(true));
    expect(decodeFloats(encodeFloats([0.1], 4), 4)![0]).toBe(Math.fround(0.1));
    expect(encodeFloats([0.1], 4)).toHaveLength(8); // 4 bytes: half the text of float64
  });

  it.each([
    ['a length not a multiple of 4', 'Zm9vYg='],
    ['a character outside the alphabet', 'Zm9v*g=='],
    ['the URL-safe alphabet (RFC 4648 §5)', 'Zm9-Yg=='],
    ['padding inside the text', 'Zg==Zm9v'],
    ['three padding characters', 'Zm9=====' ],
    ['white space', 'Zm9v Yg=='],
    ['non-ASCII letters', 'Zm9vÿg=='],
    ['bytes that are not whole floats', 'Zm9vYmFy'], // 6 bytes, not a multiple of 4
  ])('refuses %s', (_what, text) => {
    expect(decodeFloats(text, 4)).toBeUndefined();
  });

  it('refuses 4 bytes read as float64', () => {
    expect(decodeFloats('Zm9vYg==', 8)).toBeUndefined();
  });
});
