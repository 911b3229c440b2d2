import { describe, expect, it } from 'vitest';
import type { ArchiveEntry } from '../../src/pane/logic/archive';
import { gradeArchive } from '../../src/pane/logic/grade-archive';

const H = 3_600_000;
const t0 = Date.parse('2025-06-02T00:00:00+02:00');
const series = { times: [t0, t0 + H, t0 + 2 * H, t0 + 3 * H], price: [40, 50, 60, NaN] };
const entry = (issuedAt: number, time: number, forecast: number, model = 'main', band = 5): ArchiveEntry => ({
  row: 0, issuedAt, model, created: '', version: '', time, forecast, lower: forecast - band, upper: forecast + band,
});

describe('gradeArchive(entries, series)', () => {
  it('grades the last forecast issued before each period started; later issues are late, unknown prices pending', () => {
    const early = t0 - 20 * H, later = t0 - 10 * H;
    const entries = [
      entry(early, t0, 30), entry(later, t0, 44), // the later issue (44) counts for t0
      entry(early, t0 + H, 52),
      entry(later, t0 + 2 * H, 70, 'main', 2),
      entry(t0 + 5 * H, t0 + 2 * H, 60), // issued after delivery: late, not graded
      entry(later, t0 + 3 * H, 10), // price unknown: pending
    ];
    const [g] = gradeArchive(entries, series);
    // errors by hand: |44-40| = 4, |52-50| = 2, |70-60| = 10
    expect(g.periods).toBe(3);
    expect(g.mae).toBeCloseTo((4 + 2 + 10) / 3, 12);
    expect(g.rmse).toBeCloseTo(Math.sqrt((16 + 4 + 100) / 3), 12);
    expect(g.bias).toBeCloseTo((4 + 2 + 10) / 3, 12);
    expect(g.late).toBe(1);
    expect(g.pending).toBe(1);
    // inside the band: 40 in [39, 49], 50 in [47, 57]; 60 not in [68, 72]
    expect(g.coverage).toBeCloseTo(2 / 3, 12);
    expect([g.from, g.to]).toEqual([t0, t0 + 2 * H]);
  });

  it('grades each model on its own, in order of first appearance', () => {
    const at = t0 - 12 * H;
    const grades = gradeArchive([entry(at, t0, 41, 'b'), entry(at, t0, 45, 'a')], series);
    expect(grades.map((g) => [g.model, g.mae])).toEqual([['b', 1], ['a', 5]]);
  });

  it('leaves scores unknown (NaN) when nothing can be graded yet', () => {
    const [g] = gradeArchive([entry(t0 - H, t0 + 3 * H, 10)], series);
    expect(g.periods).toBe(0);
    expect(Number.isNaN(g.mae)).toBe(true);
    expect(g.pending).toBe(1);
  });
});
