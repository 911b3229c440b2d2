import uPlot from 'uplot';
import { chartSize, watchWidth } from './chart-size';

/**
 * The live validation-loss chart of training: one point per validation
 * check (x: network epochs so far across the ensemble, y: validation MAE in
 * price units). Points are added as the worker reports them and drawn at
 * most once per animation frame.
 */
export class LossChart {
  private readonly xs: number[] = [];
  private readonly ys: number[] = [];
  private plot?: uPlot;
  private pending = false;
  private unwatch: () => void = () => {};

  constructor(private readonly container: HTMLElement) {}

  add(x: number, loss: number): void {
    this.xs.push(x);
    this.ys.push(loss);
    if (!this.plot) this.create();
    if (this.pending) return;
    this.pending = true;
    requestAnimationFrame(() => {
      this.pending = false;
      this.plot?.setData([this.xs, this.ys]);
    });
  }

  get points(): number {
    return this.xs.length;
  }

  reset(): void {
    this.xs.length = 0;
    this.ys.length = 0;
    this.destroy();
  }

  destroy(): void {
    this.unwatch();
    this.plot?.destroy();
    this.plot = undefined;
  }

  private create(): void {
    const opts: uPlot.Options = {
      ...chartSize(this.container, 160),
      legend: { show: false },
      cursor: { show: false },
      scales: { x: { time: false } },
      axes: [
        { label: 'epochs', size: 32, labelSize: 14, stroke: '#47525e' },
        { label: 'validation MAE', size: 48, labelSize: 14, stroke: '#47525e' },
      ],
      series: [{}, { label: 'validation MAE', stroke: '#0f766e', width: 2, points: { show: true, size: 4 } }],
    };
    this.plot = new uPlot(opts, [this.xs, this.ys], this.container);
    this.unwatch = watchWidth(this.container, () => this.plot?.setSize(chartSize(this.container, 160)));
  }
}
