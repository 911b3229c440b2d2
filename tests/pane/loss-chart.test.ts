import { describe, expect, it } from 'vitest';
import { lossColumns } from '../../src/pane/charts/loss-chart';

describe('lossColumns(points)', () => {
  it('one y column per network over the shared epochs, null where a network has no check (uPlot\'s aligned-data layout)', () => {
    const points = [
      { network: 0, epoch: 10, loss: 9 }, { network: 0, epoch: 20, loss: 7 }, { network: 0, epoch: 30, loss: 6.5 },
      { network: 1, epoch: 10, loss: 8.5 }, { network: 1, epoch: 20, loss: 7.2 }, // stopped early
    ];
    expect(lossColumns(points)).toEqual([[10, 20, 30], [9, 7, 6.5], [8.5, 7.2, null]]);
  });

  it('no points, no line', () => {
    expect(lossColumns([])).toEqual([[]]);
  });
});
