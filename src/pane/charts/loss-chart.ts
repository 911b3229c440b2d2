import type uPlot from 'uplot';
import { chartSize, watchWidth } from './chart-size';
import { loadUplot, uplotIfLoaded } from './load-uplot';

/**
 * The live validation-loss chart of training: one line per network of the
 * ensemble (x: that network's own epochs, y: validation MAE in price
 * units), with a legend naming each network, so the lines lie over each
 * other instead of joining into one zig-zag. Points are added as the worker
 * reports them and drawn at most once per animation frame, once uPlot's
 * chunk has loaded (load-uplot.ts; fetching starts with the chart).
 */
const COLOURS = ['#0f766e', '#c2410c', '#1f6f8b', '#7c3aed', '#a16207', '#be123c', '#4d7c0f', '#334155'];

/** Aligned columns for uPlot: shared x (epochs), one y column per network, null where a network has no check. */
export function lossColumns(points: { network: number; epoch: number; loss: number }[]): [number[], ...(number | null)[][]] {
  const xs = [...new Set(points.map((p) => p.epoch))].sort((a, b) => a - b);
  const at = new Map(xs.map((x, i) => [x, i]));
  const networks = points.reduce((n, p) => Math.max(n, p.network + 1), 0);
  const ys = Array.from({ length: networks }, () => new Array<number | null>(xs.length).fill(null));
  for (const p of points) ys[p.network][at.get(p.epoch)!] = p.loss;
  return [xs, ...ys];
}

export class LossChart {
  private readonly data: { network: number; epoch: number; loss: number }[] = [];
  private plot?: uPlot;
  private lines = 0;
  private pending = false;
  private unwatch: () => void = () => {};

  constructor(private readonly container: HTMLElement) {
    void loadUplot().catch(() => {}); // fetched while the worker starts; a failure shows when drawing
  }

  add(network: number, epoch: number, loss: number): void {
    this.data.push({ network, epoch, loss });
    if (this.pending) return;
    this.pending = true;
    requestAnimationFrame(() => {
      this.pending = false;
      this.draw();
    });
  }

  get points(): number {
    return this.data.length;
  }

  /** how many networks have a line */
  get networks(): number {
    return this.lines;
  }

  reset(): void {
    this.data.length = 0;
    this.destroy();
  }

  destroy(): void {
    this.unwatch();
    this.plot?.destroy();
    this.plot = undefined;
    this.lines = 0;
  }

  private draw(): void {
    if (!uplotIfLoaded()) {
      void loadUplot().then(() => this.draw());
      return;
    }
    const columns = lossColumns(this.data);
    const lines = columns.length - 1;
    // a new network needs a new series: the chart is built again with one line more
    if (!this.plot || lines !== this.lines) this.create(lines, columns);
    else this.plot.setData(columns as uPlot.AlignedData);
  }

  private create(lines: number, columns: ReturnType<typeof lossColumns>): void {
    this.destroy();
    this.lines = lines;
    const opts: uPlot.Options = {
      ...chartSize(this.container, 170),
      legend: { show: true, live: false },
      cursor: { show: false },
      scales: { x: { time: false } },
      axes: [
        { label: 'epochs of each network', size: 32, labelSize: 14, stroke: '#47525e' },
        { label: 'validation MAE', size: 48, labelSize: 14, stroke: '#47525e' },
      ],
      series: [{}, ...Array.from({ length: lines }, (_, k): uPlot.Series => ({
        label: `network ${k + 1}`, stroke: COLOURS[k % COLOURS.length], width: 2, points: { show: true, size: 4 }, spanGaps: true,
      }))],
    };
    const UPlot = uplotIfLoaded()!;
    this.plot = new UPlot(opts, columns as uPlot.AlignedData, this.container);
    this.container.setAttribute('data-networks', String(lines));
    this.unwatch = watchWidth(this.container, () => this.plot?.setSize(chartSize(this.container, 170)));
  }
}
