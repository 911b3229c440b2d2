import seedrandom from 'seedrandom';
import { buildSeries, parseCsv, type Series } from '../../src/engine';

/**
 * A small seeded hourly series for property tests (no look-ahead,
 * determinism, save/load): daily shape, a weekday effect, one driver that
 * moves the price, AR(1) noise. It carries no reference values.
 */
export function syntheticSeries(days: number, seed = 3, startUtc = '2025-01-05T23:00:00Z', zone = 'Europe/Berlin'): Series {
  const rng = seedrandom(String(seed));
  const rows = ['timestamp,price,load_forecast'];
  const t0 = Date.parse(startUtc);
  let noise = 0;
  for (let k = 0; k < days * 24; k++) {
    const t = t0 + k * 3_600_000;
    const hour = new Date(t).getUTCHours();
    const weekday = new Date(t).getUTCDay();
    const load = 50 + 20 * Math.sin(((hour - 7) / 24) * 2 * Math.PI) + (weekday % 6 === 0 ? -10 : 0) + 5 * rng();
    noise = 0.8 * noise + 3 * (rng() - 0.5);
    const price = 20 + 0.9 * load + 0.01 * load * load / 10 + noise + k / 200;
    rows.push(`${new Date(t).toISOString()},${price.toFixed(3)},${load.toFixed(2)}`);
  }
  return buildSeries(parseCsv(rows.join('\n'), 'synthetic.csv'), { zone }).series;
}
