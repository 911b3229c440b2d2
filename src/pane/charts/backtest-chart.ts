import type uPlot from 'uplot';
import type { CheckRow } from '../jobs/protocol';
import { chartSize, watchWidth } from './chart-size';
import { loadUplot } from './load-uplot';

/**
 * Actual prices against the model's forecast (and the naive-week yardstick)
 * over the test span, in the market's own clock (uPlot.tzDate), with the
 * band as two thin lines. Unknown values are gaps (null). Drawn once uPlot's
 * chunk has loaded (load-uplot.ts).
 *
 * @returns a function that removes the chart
 */
export function drawBacktestChart(container: HTMLElement, rows: CheckRow[], zone: string, label: string): () => void {
  let removed = false;
  let remove = () => {};
  void loadUplot().then((UPlot) => {
    if (!removed) remove = draw(UPlot, container, rows, zone, label);
  });
  return () => { removed = true; remove(); };
}

function draw(UPlot: typeof uPlot, container: HTMLElement, rows: CheckRow[], zone: string, label: string): () => void {
  const n = (x: number) => (Number.isFinite(x) ? x : null);
  const data: uPlot.AlignedData = [
    rows.map((r) => r.time / 1000),
    rows.map((r) => n(r.actual)),
    rows.map((r) => n(r.forecast)),
    rows.map((r) => n(r.lower)),
    rows.map((r) => n(r.upper)),
    rows.map((r) => n(r.naiveWeek)),
  ];
  const opts: uPlot.Options = {
    ...chartSize(container, 220),
    tzDate: (ts) => UPlot.tzDate(new Date(ts * 1000), zone),
    legend: { show: true, live: false },
    axes: [{ stroke: '#47525e', size: 48 }, { stroke: '#47525e', size: 44, label: 'price', labelSize: 14 }],
    series: [
      {},
      { label: 'actual', stroke: '#1f2933', width: 1.5 },
      { label, stroke: '#0f766e', width: 1.5 },
      { label: 'lower', stroke: '#8fcfc6', width: 1, dash: [4, 3] },
      { label: 'upper', stroke: '#8fcfc6', width: 1, dash: [4, 3] },
      { label: 'naive-week', stroke: '#c2410c', width: 1, dash: [2, 2], show: false },
    ],
  };
  const plot = new UPlot(opts, data, container);
  const unwatch = watchWidth(container, () => plot.setSize(chartSize(container, 220)));
  return () => { unwatch(); plot.destroy(); };
}
