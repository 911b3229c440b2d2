/**
 * Level-following variance stabilisation of prices.
 *
 * Each delivery day D gets its own centre and scale: the median and the
 * MAD (× 1.4826, the normal-consistency factor) of all prices of the
 * `window` days before D. Prices of D and of its lag days are mapped with
 * z = asinh((p − median) / MAD), the area hyperbolic sine transform of
 * Uniejewski, Kowalski & Weron (2018), "Variance stabilizing transformations
 * for electricity spot price forecasting", IEEE Trans. Power Systems 33(2).
 * Fitting it on a recent window only (our choice) lets the model follow a
 * moving price level: it learns shapes relative to the last weeks, and the
 * window is always known before D, so nothing leaks from D.
 */
export interface LevelScale {
  centre: number;
  scale: number;
}

const MAD_TO_SD = 1.4826;

/** @returns the scale for target day `d` from price rows d-window .. d-1, or undefined with no known price */
export function levelScale(price: Float64Array[], d: number, window: number): LevelScale | undefined {
  const values: number[] = [];
  for (let k = Math.max(0, d - window); k < d; k++) for (const v of price[k]) if (!Number.isNaN(v)) values.push(v);
  if (values.length === 0) return undefined;
  const centre = median(values);
  const mad = median(values.map((v) => Math.abs(v - centre))) * MAD_TO_SD;
  // a flat window (a capped or regulated price) would give scale 0: keep a floor
  const spread = Math.max(mad, 1e-3 * Math.max(1, Math.abs(centre)), 1e-6);
  return { centre, scale: spread };
}

export function toScaled(p: number, { centre, scale }: LevelScale): number {
  return Math.asinh((p - centre) / scale);
}

export function fromScaled(z: number, { centre, scale }: LevelScale): number {
  return centre + scale * Math.sinh(z);
}

function median(values: number[]): number {
  const s = Float64Array.from(values).sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
