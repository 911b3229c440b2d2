/**
 * Maps scaled prices into the open interval the sigmoid output layer can
 * reach: y = 0.1 + 0.8 (z − lo) / (hi − lo) per slot, with lo and hi the
 * training range widened by a quarter (at least 0.5) so that new extremes
 * stay reachable.
 */
export interface UnitRange {
  lo: Float64Array;
  hi: Float64Array;
}

export function fitUnitRange(targets: Float64Array[]): UnitRange {
  const m = targets[0].length;
  const lo = new Float64Array(m).fill(Infinity);
  const hi = new Float64Array(m).fill(-Infinity);
  for (const y of targets) y.forEach((v, k) => { lo[k] = Math.min(lo[k], v); hi[k] = Math.max(hi[k], v); });
  for (let k = 0; k < m; k++) {
    const pad = Math.max(0.25 * (hi[k] - lo[k]), 0.5);
    lo[k] -= pad; hi[k] += pad;
  }
  return { lo, hi };
}

/** Into (0, 1); values beyond the range are held just inside it. */
export function toUnit(z: Float64Array, { lo, hi }: UnitRange): Float64Array {
  return z.map((v, k) => Math.min(0.98, Math.max(0.02, 0.1 + (0.8 * (v - lo[k])) / (hi[k] - lo[k]))));
}

export function fromUnit(u: Float64Array, { lo, hi }: UnitRange): Float64Array {
  return u.map((v, k) => lo[k] + ((v - 0.1) * (hi[k] - lo[k])) / 0.8);
}
