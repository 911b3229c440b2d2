import { InputError } from '../errors';

/** More players than this would take 2^G forward passes beyond any interactive use. */
export const MAX_PLAYERS = 16;

/**
 * Exact Shapley values of a game with `players` players whose value is a
 * vector (one number per delivery period): player i gets
 *
 *   φ_i = Σ_{S ⊆ N∖{i}} |S|! (G − |S| − 1)! / G! · (v(S ∪ {i}) − v(S)),
 *
 * with coalitions as bitmasks (bit i set = player i in S). The value is
 * asked once per coalition (2^G calls). The values add up to
 * v(N) − v(∅) (efficiency) and a player whose joining never changes the
 * value gets exactly 0 (null player), because each difference is then 0.
 * Source: L. S. Shapley (1953), "A value for n-person games", Contributions
 * to the Theory of Games II; the formula as in Lundberg & Lee (2017), "A
 * unified approach to interpreting model predictions", NeurIPS, eq. (4).
 *
 * @example exactShapley(2, (m) => Float64Array.of((m & 1) + 2 * (m >> 1) + (m === 3 ? 1 : 0))) // [[1.5], [2.5]]
 * @throws InputError for more than MAX_PLAYERS players
 */
export function exactShapley(players: number, value: (mask: number) => Float64Array): Float64Array[] {
  if (!Number.isInteger(players) || players < 0 || players > MAX_PLAYERS) {
    throw new InputError(`an exact explanation handles 0 to ${MAX_PLAYERS} input groups, got ${players}`);
  }
  const coalitions = 1 << players;
  const values: Float64Array[] = [];
  for (let mask = 0; mask < coalitions; mask++) values.push(value(mask));
  const m = values[0].length;
  const weight = coalitionWeights(players);
  const phi = Array.from({ length: players }, () => new Float64Array(m));
  for (let mask = 0; mask < coalitions; mask++) {
    const size = popCount(mask);
    for (let i = 0; i < players; i++) {
      const bit = 1 << i;
      if (mask & bit) continue;
      const w = weight[size], with_ = values[mask | bit], without = values[mask], out = phi[i];
      for (let s = 0; s < m; s++) out[s] += w * (with_[s] - without[s]);
    }
  }
  return phi;
}

/** |S|! (G − |S| − 1)! / G! for |S| = 0 … G − 1, as 1 / (G · C(G − 1, |S|)) to keep it exact for small G. */
function coalitionWeights(players: number): Float64Array {
  const w = new Float64Array(Math.max(players, 1));
  let binom = 1;
  for (let s = 0; s < players; s++) {
    w[s] = 1 / (players * binom);
    binom = (binom * (players - 1 - s)) / (s + 1);
  }
  return w;
}

function popCount(mask: number): number {
  let n = 0;
  for (let v = mask; v; v &= v - 1) n++;
  return n;
}
