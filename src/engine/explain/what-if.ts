import { InputError } from '../errors';
import { toWallClock } from '../series/local-clock';
import type { Series } from '../series/series';

/** A change of one driver on one delivery day: by a share of its value, or by an amount in its own unit. */
export interface DriverStep {
  driver: string;
  /** `percent`: value × (1 + amount / 100); `add`: value + amount */
  kind: 'percent' | 'add';
  amount: number;
}

/**
 * The series with one driver changed on every period of one delivery day
 * (local date `day` in the series' zone), for a what-if: "wind +10 %",
 * "temperature +2 degrees". The input series is not changed.
 *
 * @example withDriverStep(series, '2026-11-30', { driver: 'wind_forecast', kind: 'percent', amount: 30 })
 * @throws InputError for an unknown driver or an amount that is not a finite number
 */
export function withDriverStep(series: Series, day: string, step: DriverStep): Series {
  const values = series.drivers[step.driver];
  if (!values) throw new InputError(`the what-if driver "${step.driver}" is not among the drivers ${Object.keys(series.drivers).join(', ') || '(none)'}`);
  if (!Number.isFinite(step.amount)) throw new InputError(`the what-if step for "${step.driver}" must be a number, got ${step.amount}`);
  const changed = values.map((v, i) => {
    if (toWallClock(series.times[i], series.zone).date !== day) return v;
    return step.kind === 'percent' ? v * (1 + step.amount / 100) : v + step.amount;
  });
  return { ...series, drivers: { ...series.drivers, [step.driver]: changed } };
}
