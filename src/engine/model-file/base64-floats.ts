import { z } from '../schema-config';

/**
 * Float arrays as base64 text (RFC 4648 §4) of their little-endian IEEE 754
 * bytes: exact, about a third the size of decimal JSON, and free of
 * Node's Buffer so it runs in the pane and workers too.
 */
const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const LOOKUP = new Int16Array(128).fill(-1);
for (let i = 0; i < ALPHABET.length; i++) LOOKUP[ALPHABET.charCodeAt(i)] = i;

export const BASE64 = /^[A-Za-z0-9+/]*={0,2}$/;

/** The schema piece of a float array as base64 text, at most the model file's 2 MB (its length is checked when decoded). */
export const Base64Floats = z.string().max(2 * 1024 * 1024).regex(BASE64, 'not base64 text');

export function encodeFloats(values: ArrayLike<number>, bytes: 4 | 8): string {
  const buf = new ArrayBuffer(values.length * bytes);
  const view = new DataView(buf);
  for (let i = 0; i < values.length; i++) {
    if (bytes === 4) view.setFloat32(i * 4, values[i], true);
    else view.setFloat64(i * 8, values[i], true);
  }
  return encodeBytes(new Uint8Array(buf));
}

/** @returns the floats, or undefined when the text is not whole floats in base64 */
export function decodeFloats(text: string, bytes: 4 | 8): Float64Array | undefined {
  const raw = decodeBytes(text);
  if (!raw || raw.length % bytes !== 0) return undefined;
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  const out = new Float64Array(raw.length / bytes);
  for (let i = 0; i < out.length; i++) out[i] = bytes === 4 ? view.getFloat32(i * 4, true) : view.getFloat64(i * 8, true);
  return out;
}

/** Bytes as base64 text (RFC 4648 §4). */
export function encodeBytes(b: Uint8Array): string {
  let out = '';
  for (let i = 0; i < b.length; i += 3) {
    const n = (b[i] << 16) | ((b[i + 1] ?? 0) << 8) | (b[i + 2] ?? 0);
    out += ALPHABET[(n >> 18) & 63] + ALPHABET[(n >> 12) & 63];
    out += i + 1 < b.length ? ALPHABET[(n >> 6) & 63] : '=';
    out += i + 2 < b.length ? ALPHABET[n & 63] : '=';
  }
  return out;
}

/** @returns the bytes of base64 text, or undefined when it is not base64 */
export function decodeBytes(text: string): Uint8Array | undefined {
  if (text.length % 4 !== 0 || !BASE64.test(text)) return undefined;
  const pad = text.endsWith('==') ? 2 : text.endsWith('=') ? 1 : 0;
  const out = new Uint8Array((text.length / 4) * 3 - pad);
  let o = 0;
  for (let i = 0; i < text.length; i += 4) {
    const c = [0, 1, 2, 3].map((k) => (text[i + k] === '=' ? 0 : LOOKUP[text.charCodeAt(i + k)]));
    if (c.some((v) => v < 0)) return undefined;
    const n = (c[0] << 18) | (c[1] << 12) | (c[2] << 6) | c[3];
    if (o < out.length) out[o++] = (n >> 16) & 255;
    if (o < out.length) out[o++] = (n >> 8) & 255;
    if (o < out.length) out[o++] = n & 255;
  }
  return out;
}
