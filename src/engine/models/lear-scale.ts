/**
 * LEAR's variance-stabilising transform of one column over the calibration
 * window: z = asinh((x − median) / MAD), MAD = median |x − median| / Φ⁻¹(3/4)
 * (normal-consistent), fitted on the window's values and applied unchanged
 * to the forecast day's input (Uniejewski, Kowalski & Weron 2018, "Variance
 * stabilizing transformations for electricity spot price forecasting", IEEE
 * Trans. Power Systems 33(2); used by Lago et al. 2021 on every price and
 * exogenous column of the calibration window, the "invariant" scaler of the
 * public code beside that paper, whose MAD is statsmodels' `robust.mad`).
 *
 * Our guard: where more than half of a column's values are equal (MAD = 0,
 * e.g. a solar forecast at night or a capped price) the population standard
 * deviation takes the MAD's place, and 1 where the column is constant.
 *
 * @example robustScale(Float64Array.of(1, 2, 3, 4, 100)) // { centre: 3, scale: 1.4826… }
 */
export interface RobustScale {
  centre: number;
  scale: number;
}

/** 1 / Φ⁻¹(3/4), the constant of statsmodels' robust.mad and R's mad() (1.4826 rounded). */
export const MAD_TO_SD = 1 / 0.6744897501960817;

export function robustScale(values: Float64Array): RobustScale {
  const centre = median(values);
  const dev = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) dev[i] = Math.abs(values[i] - centre);
  let scale = median(dev) * MAD_TO_SD;
  if (!(scale > 0)) {
    let mean = 0;
    for (const v of values) mean += v;
    mean /= values.length;
    let ss = 0;
    for (const v of values) ss += (v - mean) ** 2;
    scale = Math.sqrt(ss / values.length);
    if (!(scale > 0)) scale = 1;
  }
  return { centre, scale };
}

export function toAsinh(x: number, { centre, scale }: RobustScale): number {
  return Math.asinh((x - centre) / scale);
}

export function fromAsinh(z: number, { centre, scale }: RobustScale): number {
  return centre + scale * Math.sinh(z);
}

function median(values: Float64Array): number {
  const s = Float64Array.from(values).sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
