import { bias, dayStartUtc, mae, rmse, smape, toWallClock, type Series } from '../../engine';
import type { ArchiveEntry } from './archive';

/** How one model's issued forecasts did against the prices that came in. */
export interface ArchiveGrade {
  model: string;
  /**
   * Archived delivery periods of this model, each counted once, in one of
   * three kinds: graded, late or waiting.
   */
  /** periods with a forecast issued in time and a known actual price */
  graded: number;
  /** periods with a forecast issued in time whose price is not known yet */
  waiting: number;
  /** periods whose every forecast was issued after their delivery day had begun (not graded) */
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

/** What "late" means, in the words the pane shows. */
export const LATE_MEANING = 'a forecast issued after its delivery day had begun, so not a fair day-ahead forecast, is late and not graded';

/**
 * Grades the archive against actual prices. A day-ahead forecast is made
 * before its delivery day: for every model and delivery period, the
 * forecast that counts is the last one issued before the local midnight
 * that starts the period's delivery day (in the market zone of the series).
 * A forecast issued later is late: it may have seen the day's own prices,
 * so it is not graded. Each archived period of a model is counted once:
 * graded (an in-time forecast and a known price), waiting (an in-time
 * forecast, price not known yet) or late (only late forecasts).
 *
 * @param entries archive rows (parseArchive)
 * @param series the price series from Data; its prices are the actuals, its zone the market's
 * @returns one grade per model, in order of first appearance
 * Source: metric definitions in src/engine/metrics (MAE, RMSE, sMAPE, bias);
 *   day-ahead timing: common practice (the auction closes the day before delivery).
 */
export function gradeArchive(entries: ArchiveEntry[], series: Pick<Series, 'times' | 'price' | 'zone'>): ArchiveGrade[] {
  const priceAt = new Map<number, number>();
  series.times.forEach((t, i) => priceAt.set(t, series.price[i]));
  const dayStart = new Map<number, number>();
  const startOfDay = (t: number) => {
    let d = dayStart.get(t);
    if (d === undefined) { d = dayStartUtc(toWallClock(t, series.zone).date, series.zone); dayStart.set(t, d); }
    return d;
  };
  const byModel = new Map<string, { chosen: Map<number, ArchiveEntry>; late: Set<number> }>();
  for (const e of entries) {
    if (!Number.isFinite(e.forecast)) continue; // an empty forecast cell issued nothing
    let m = byModel.get(e.model);
    if (!m) { m = { chosen: new Map(), late: new Set() }; byModel.set(e.model, m); }
    if (e.issuedAt >= startOfDay(e.time)) { m.late.add(e.time); continue; }
    const before = m.chosen.get(e.time);
    if (!before || e.issuedAt >= before.issuedAt) m.chosen.set(e.time, e);
  }
  const grades: ArchiveGrade[] = [];
  for (const [model, { chosen, late }] of byModel) {
    const graded = [...chosen.values()].filter((e) => Number.isFinite(priceAt.get(e.time))).sort((a, b) => a.time - b.time);
    const waiting = chosen.size - graded.length;
    const onlyLate = [...late].filter((t) => !chosen.has(t)).length;
    const actual = graded.map((e) => priceAt.get(e.time) as number);
    const forecast = graded.map((e) => e.forecast);
    const grade: ArchiveGrade = { model, graded: graded.length, waiting, late: onlyLate, mae: NaN, rmse: NaN, smape: NaN, bias: NaN };
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

/** The count line shown beside "Grade the archive", with singular and plural right. */
export function gradeSummary(grades: ArchiveGrade[]): string {
  const sum = (k: 'graded' | 'late' | 'waiting') => grades.reduce((n, g) => n + g[k], 0);
  const [graded, late, waiting] = [sum('graded'), sum('late'), sum('waiting')];
  const periods = (n: number) => `${n} period${n === 1 ? '' : 's'}`;
  const parts = [`graded ${periods(graded)}`];
  parts.push(`${late} late (issued after ${late === 1 ? 'its' : 'their'} delivery day had begun)`);
  parts.push(`${waiting} waiting for ${waiting === 1 ? 'its price' : 'their prices'}`);
  return `Of ${periods(graded + late + waiting)} in the archive: ${parts.join(', ')}.`;
}
