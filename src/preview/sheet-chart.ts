import uPlot from 'uplot';
import type { CellValue } from '../host/workbook-port';
import { h } from '../pane/dom';

/**
 * Draws a line chart that the pane placed on a sheet (WorkbookPort.addLineChart),
 * as the preview's stand-in for the host's native chart: the first row names
 * the series, the first column holds the categories (delivery starts), every
 * other column is one line; cells that are not numbers are gaps.
 *
 * @returns a function that removes the chart
 * @example drawSheetChart(box, 'Tomorrow', [['start', 'forecast'], ['00:00', 41.2]])
 */
const COLOURS = ['#0f766e', '#8fcfc6', '#8fcfc6', '#c2410c', '#6b21a8', '#1f2933'];

export function drawSheetChart(container: HTMLElement, title: string, values: CellValue[][]): () => void {
  const [header = [], ...rows] = values;
  const used = rows.filter((r) => r.some((v) => v !== null && v !== ''));
  const caption = h('figcaption', { class: 'pv-chart-title', text: title });
  container.appendChild(caption);
  if (used.length === 0 || header.length < 2) {
    caption.textContent = `${title}: no values to draw yet`;
    return () => caption.remove();
  }
  const labels = used.map((r) => String(r[0] ?? ''));
  const data: uPlot.AlignedData = [
    used.map((_, i) => i),
    ...header.slice(1).map((_, k) => used.map((r) => (typeof r[k + 1] === 'number' ? (r[k + 1] as number) : null))),
  ];
  const width = Math.max(320, Math.floor(container.clientWidth || 560));
  const plot = new uPlot({
    width,
    height: 200,
    legend: { show: true, live: false },
    cursor: { show: false },
    scales: { x: { time: false } },
    axes: [
      { stroke: '#47525e', size: 36, values: (_u, ticks) => ticks.map((t) => clock(labels[Math.round(t)] ?? '')) },
      { stroke: '#47525e', size: 48 },
    ],
    series: [{}, ...header.slice(1).map((name, k) => ({ label: String(name ?? `series ${k + 1}`), stroke: COLOURS[k % COLOURS.length], width: k === 0 ? 2 : 1 }))],
  }, data, container);
  return () => { plot.destroy(); caption.remove(); };
}

/** The clock time of a timestamp text, ISO or as a date-time cell shows it (HH:MM), or the text itself. */
function clock(label: string): string {
  const m = /\d[T ](\d{2}:\d{2})/.exec(label);
  return m ? m[1] : label;
}
