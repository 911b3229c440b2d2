import { bias, mae, rmse, smape, type Series } from '../../engine';
import type { ArchiveEntry } from './archive';

/** How one model's issued forecasts did against the prices that came in. */
export interface ArchiveGrade {
  model: string;
  /** periods with an issued forecast and a known actual price */
  periods: number;
  /** issued periods still waiting for their price */
  pending: number;
  /** entries issued after their delivery period had started (not graded) */
  late: number;
  mae: number;
  rmse: number;
  smape: number;
  bias: number;
  /** share of actual prices inside the issued band, when bands were issued */
  coverage?: number;
  /** first and last graded delivery start (UTC ms) */
  from?: number;
  to?: number;
}

/**
 * Grades the archive against actual prices: for every model and delivery
 * period, the forecast that counts is the last one issued before the period
 * started (a desk is judged on what it had issued in time). Entries issued
 * later are counted as late and left out; periods whose price is not known
 * yet are pending.
 *
 * @param entries archive rows (parseArchive)
 * @param series the price series from Data; its prices are the actuals
 * @returns one grade per model, in order of first appearance
 * Source: metric definitions in src/engine/metrics (MAE, RMSE, sMAPE, bias).
 */
export function gradeArchive(entries: ArchiveEntry[], series: Pick<Series, 'times' | 'price'>): ArchiveGrade[] {
  const priceAt = new Map<number, number>();
  series.times.forEach((t, i) => priceAt.set(t, series.price[i]));
  const byModel = new Map<string, { chosen: Map<number, ArchiveEntry>; late: number }>();
  for (const e of entries) {
    let m = byModel.get(e.model);
    if (!m) { m = { chosen: new Map(), late: 0 }; byModel.set(e.model, m); }
    if (e.issuedAt >= e.time) { m.late++; continue; }
    const before = m.chosen.get(e.time);
    if (!before || e.issuedAt >= before.issuedAt) m.chosen.set(e.time, e);
  }
  const grades: ArchiveGrade[] = [];
  for (const [model, { chosen, late }] of byModel) {
    const graded = [...chosen.values()].filter((e) => Number.isFinite(priceAt.get(e.time)) && Number.isFinite(e.forecast)).sort((a, b) => a.time - b.time);
    const pending = [...chosen.values()].filter((e) => !Number.isFinite(priceAt.get(e.time))).length;
    const actual = graded.map((e) => priceAt.get(e.time) as number);
    const forecast = graded.map((e) => e.forecast);
    const grade: ArchiveGrade = { model, periods: graded.length, pending, late, mae: NaN, rmse: NaN, smape: NaN, bias: NaN };
    if (graded.length) {
      Object.assign(grade, { mae: mae(actual, forecast), rmse: rmse(actual, forecast), smape: smape(actual, forecast), bias: bias(actual, forecast) });
      grade.from = graded[0].time;
      grade.to = graded[graded.length - 1].time;
      const banded = graded.filter((e) => Number.isFinite(e.lower) && Number.isFinite(e.upper));
      if (banded.length) grade.coverage = banded.filter((e) => { const a = priceAt.get(e.time) as number; return a >= e.lower && a <= e.upper; }).length / banded.length;
    }
    grades.push(grade);
  }
  return grades;
}
