import { buildSeries, parseCsv, inputFrame, frameBefore, DEMO_MARKET, SOLAR_MARKET, generateMarket, toCsv } from './src/engine';
import { calibrateLear } from './src/engine/models/lear-calibrate';
const spec = process.env.M === 'solar' ? SOLAR_MARKET : DEMO_MARKET;
const { series } = buildSeries(parseCsv(toCsv(generateMarket(spec, 1)), spec.name), { zone: spec.zone });
const frame = inputFrame(series);
const d = frame.days.length - 91;
for (let k = 0; k < 4; k++) {
  const t = process.cpuUsage();
  const w = performance.now();
  const cal = calibrateLear(frameBefore(frame, d + k));
  const u = process.cpuUsage(t);
  console.log(cal.design.level, cal.days, cal.design.inputs.length, 'cpu', ((u.user + u.system) / 1000).toFixed(0), 'ms wall', (performance.now() - w).toFixed(0), cal.periods.slice(0, 24).map((p) => p.selected).join(' '));
}
