import { describe, expect, it } from 'vitest';
import type { ArchiveEntry } from '../../src/pane/logic/archive';
import { gradeArchive, gradeSummary } from '../../src/pane/logic/grade-archive';

const H = 3_600_000;
// delivery day 2025-06-02 in Berlin starts at 2025-06-01T22:00Z (CEST, UTC+2; IANA tz database)
const t0 = Date.parse('2025-06-02T06:00:00+02:00');
const midnight = Date.parse('2025-06-02T00:00:00+02:00');
const series = { times: [t0, t0 + H, t0 + 2 * H, t0 + 3 * H], price: [40, 50, 60, NaN], zone: 'Europe/Berlin' };
const entry = (issuedAt: number, time: number, forecast: number, model = 'main', band = 5): ArchiveEntry => ({
  row: 0, issuedAt, model, created: '', version: '', time, forecast, lower: forecast - band, upper: forecast + band,
});

describe('gradeArchive(entries, series)', () => {
  it('grades the last forecast issued before each period\'s delivery day began; counts graded, late and waiting periods once each', () => {
    const early = midnight - 20 * H, later = midnight - 10 * H;
    const entries = [
      entry(early, t0, 30), entry(later, t0, 44), // the later issue (44) counts for t0
      entry(early, t0 + H, 52),
      entry(later, t0 + 2 * H, 70, 'main', 2),
      entry(t0 + 5 * H, t0 + 2 * H, 60), // issued on the delivery day itself: late, not graded (t0+2H is graded from the earlier issue)
      entry(later, t0 + 3 * H, 10), // price unknown: waiting
      entry(midnight + H, t0 + 4 * H, 55), // issued at 01:00 of the delivery day, before the period: still late
      entry(midnight + 2 * H, t0 + 4 * H, 56), // the same late period again: counted once
    ];
    const [g] = gradeArchive(entries, series);
    // errors by hand: |44-40| = 4, |52-50| = 2, |70-60| = 10
    expect([g.graded, g.late, g.waiting]).toEqual([3, 1, 1]);
    expect(g.mae).toBeCloseTo((4 + 2 + 10) / 3, 12);
    expect(g.rmse).toBeCloseTo(Math.sqrt((16 + 4 + 100) / 3), 12);
    expect(g.bias).toBeCloseTo((4 + 2 + 10) / 3, 12);
    // inside the band: 40 in [39, 49], 50 in [47, 57]; 60 not in [68, 72]
    expect(g.coverage).toBeCloseTo(2 / 3, 12);
    expect([g.from, g.to]).toEqual([t0, t0 + 2 * H]);
  });

  it('a forecast issued one second before the delivery day\'s midnight is in time; at midnight it is late', () => {
    const [inTime] = gradeArchive([entry(midnight - 1000, t0, 41)], series);
    const [late] = gradeArchive([entry(midnight, t0, 41)], series);
    expect([inTime.graded, inTime.late, late.graded, late.late]).toEqual([1, 0, 0, 1]);
  });

  it('grades each model on its own, in order of first appearance', () => {
    const at = midnight - 12 * H;
    const grades = gradeArchive([entry(at, t0, 41, 'b'), entry(at, t0, 45, 'a')], series);
    expect(grades.map((g) => [g.model, g.mae])).toEqual([['b', 1], ['a', 5]]);
  });

  it('leaves scores unknown (NaN) when nothing can be graded yet', () => {
    const [g] = gradeArchive([entry(midnight - H, t0 + 3 * H, 10)], series);
    expect([g.graded, g.waiting]).toEqual([0, 1]);
    expect(Number.isNaN(g.mae)).toBe(true);
  });
});

describe('gradeSummary(grades)', () => {
  it('says how many periods were graded, late and waiting, with singular and plural right', () => {
    const late24 = gradeArchive(Array.from({ length: 24 }, (_, i) => entry(t0 + 30 * H, t0 + i * H, 40)), { ...series, times: [], price: [] });
    expect(gradeSummary(late24)).toBe('Of 24 periods in the archive: graded 0 periods, 24 late (issued after their delivery day had begun), 0 waiting for their prices.');
    const one = gradeArchive([entry(midnight - H, t0, 41), entry(t0 + H, t0 + H, 41), entry(midnight - H, t0 + 3 * H, 1)], series);
    expect(gradeSummary(one)).toBe('Of 3 periods in the archive: graded 1 period, 1 late (issued after its delivery day had begun), 1 waiting for its price.');
  });
});
