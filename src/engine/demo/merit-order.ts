/**
 * Price of the marginal unit on an invented, merit-order-like supply curve.
 *
 * `share` is the residual load (load minus wind and solar) as a share of the
 * dispatchable capacity. The curve rises with the share, and faster and
 * faster towards full use (convex above about 45 %: costly peaking units set
 * the price at high load, and scarcity pricing adds a steep tail above
 * ~95 %). At low
 * residual load, renewables with support schemes set the price, which sinks
 * towards and below zero. The result scales with `fuel`, the marginal fuel
 * and carbon cost of a mid-merit plant in currency/MWh.
 *
 * Shape is common practice for stylised merit-order models, not fitted to a
 * real market.
 *
 * @param share - residual load / dispatchable capacity (≈ 0 … 1.1; may be below 0)
 * @param fuel - mid-merit marginal cost in currency/MWh (> 0)
 * @returns price in currency/MWh; negative at very low `share`
 * @example meritOrderPrice(0.6, 60) // ≈ 68
 * @see https://en.wikipedia.org/wiki/Merit_order (the merit-order effect)
 */
export function meritOrderPrice(share: number, fuel: number): number {
  const u = Math.max(share, 0);
  const thermal = fuel * (0.25 + u + 2.2 * u ** 4);
  const scarcity = fuel * 0.5 * Math.exp(Math.min((share - 0.98) / 0.03, 6));
  const renewable = -12 - 40 / (1 + Math.exp(-(0.08 - share) / 0.04));
  const w = 1 / (1 + Math.exp(-(share - 0.22) / 0.05)); // weight of the thermal part
  return w * (thermal + scarcity) + (1 - w) * renewable;
}
