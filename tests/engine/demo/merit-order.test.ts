import { describe, expect, it } from 'vitest';
import { meritOrderPrice } from '../../../src/engine/demo/merit-order';

const grid = Array.from({ length: 141 }, (_, i) => -0.2 + i * 0.01); // share −0.2 … 1.2

describe('meritOrderPrice(share, fuel)', () => {
  it('rises with residual load everywhere', () => {
    for (let i = 1; i < grid.length; i++) {
      expect(meritOrderPrice(grid[i], 60), `share ${grid[i]}`).toBeGreaterThan(meritOrderPrice(grid[i - 1], 60));
    }
  });

  it('is convex above 45 % use: each step costs more than the one before', () => {
    for (let u = 0.45; u < 1.1; u += 0.01) {
      const second = meritOrderPrice(u + 0.01, 60) - 2 * meritOrderPrice(u, 60) + meritOrderPrice(u - 0.01, 60);
      expect(second, `share ${u}`).toBeGreaterThan(0);
    }
    // Going from 90 % to 100 % use adds much more than going from 40 % to 50 %.
    const top = meritOrderPrice(1.0, 60) - meritOrderPrice(0.9, 60);
    const mid = meritOrderPrice(0.5, 60) - meritOrderPrice(0.4, 60);
    expect(top).toBeGreaterThan(5 * mid);
  });

  it('goes below zero when wind and solar cover nearly all the load', () => {
    expect(meritOrderPrice(0.1, 60)).toBeLessThan(0);
    expect(meritOrderPrice(-0.1, 60)).toBeLessThan(-30);
    expect(meritOrderPrice(0.5, 60)).toBeGreaterThan(30);
  });

  it('scales with the fuel cost where thermal plants set the price', () => {
    expect(meritOrderPrice(0.6, 120) / meritOrderPrice(0.6, 60)).toBeCloseTo(2, 2);
    expect(meritOrderPrice(0.6, 90)).toBeGreaterThan(meritOrderPrice(0.6, 60));
  });
});
