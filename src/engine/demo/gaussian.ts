/**
 * A source of standard normal draws built on a uniform random source
 * (Box–Muller transform; each pair of uniforms gives two normal draws).
 *
 * @param random - uniform source on [0, 1), e.g. a seeded `seedrandom` generator
 * @returns a function giving one N(0, 1) draw per call
 * @example gaussianSource(seedrandom.alea('1'))() // ≈ -0.3 (depends on the seed)
 * @see https://en.wikipedia.org/wiki/Box%E2%80%93Muller_transform (Box & Muller, 1958)
 */
export function gaussianSource(random: () => number): () => number {
  let spare = NaN;
  return () => {
    if (!Number.isNaN(spare)) {
      const z = spare;
      spare = NaN;
      return z;
    }
    const r = Math.sqrt(-2 * Math.log(1 - random())); // 1 - u in (0, 1]: keeps log() finite
    const angle = 2 * Math.PI * random();
    spare = r * Math.sin(angle);
    return r * Math.cos(angle);
  };
}
