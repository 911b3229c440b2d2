import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createModel, inputFrame, type Learner, storedModelText, toStoredModel } from '../../src/engine';
import { syntheticSeries } from '../support/synthetic';
import { runCli, scratch, writeFile } from './run-cli';

// the synthetic hourly series (Europe/Berlin) to 2025-05-04; the rows of 2025-05-04 have drivers and no price
function files(dir: string, loadOfOneRow: (load: number) => string) {
  const full = syntheticSeries(120);
  const cut = full.times.findIndex((t) => t >= Date.parse('2025-05-04T00:00:00+02:00'));
  const series = { ...full, times: full.times.slice(0, cut + 24) };
  const model = createModel('linear', { seed: 1 }) as Learner;
  model.fit(inputFrame({ ...series, times: series.times.slice(0, cut), price: series.price.slice(0, cut), drivers: { load_forecast: series.drivers.load_forecast.slice(0, cut) } }));
  const modelFile = join(dir, 'm.json');
  writeFileSync(modelFile, storedModelText(toStoredModel(model, { name: 'm', zone: series.zone, resolution: 60 })));
  const rows = ['timestamp,price,load_forecast'];
  series.times.forEach((t, i) => {
    const load = series.drivers.load_forecast[i];
    rows.push(`${new Date(t).toISOString()},${i < cut ? series.price[i] : ''},${i === cut + 5 ? loadOfOneRow(load) : load}`);
  });
  return { modelFile, input: writeFile(dir, 'next.csv', rows.join('\n')) };
}

describe('spotloom forecast with an extreme driver value (found by tests/fuzz/model-file)', () => {
  it('never prints Infinity (a load forecast of 1e300 in one row printed Infinity for every hour with exit 0)', () => {
    const dir = scratch();
    const { modelFile, input } = files(dir, () => '1e300');
    const r = runCli(['forecast', '--model', modelFile, '--input', input]);
    expect(r.stdout).not.toMatch(/Infinity|NaN/);
    expect(r.stderr).not.toMatch(/^\s+at .*:\d+/m);
    // refused with a message naming the driver and the value (learner.ts: more than 20 sd from its mean)
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/driver "load_forecast" is 1e\+300 in slot \d+, more than 20 standard deviations from its training mean/);
  });
});
