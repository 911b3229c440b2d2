import type { DayFrame } from '../series/day-frame';

/**
 * The inputs of LEAR's model for one period of the day, and the reduced sets
 * used where the history cannot support the published one.
 *
 * As published (Lago, Marcjasz, De Schutter & Weron 2021, "Forecasting
 * day-ahead electricity prices: a review of state-of-the-art algorithms,
 * best practices and an open-access benchmark", Applied Energy 293, 116983,
 * §5.1 — recalled from memory): for every hour h of day D the same inputs,
 * the prices of all 24 hours of D-1, D-2, D-3 and D-7, each exogenous
 * series (day-ahead forecasts) at all 24 hours of D, D-1 and D-7, and seven
 * weekday dummies. The public code beside the paper (epftoolbox `_lear.py`)
 * takes the exogenous lags D-1 and D-2 though its comment says D-7; we
 * follow the paper's text: D, D-1, D-7.
 *
 * Our choices: "hours" are the frame's clock slots (delivery-day layout of
 * day-matrix.ts, so a daylight-saving day has fixed clock slots), and a
 * level is taken per calibration, the richest whose per-period input count
 * p is at most half the usable calibration days n (`DAYS_PER_INPUT` = 2: the
 * least-squares noise variance of the information criterion then keeps
 * n − p − 1 ≥ n/2 − 1 degrees of freedom):
 *
 * | level | prices | each driver | weekday |
 * |---|---|---|---|
 * | `published` | all slots of D-1, D-2, D-3, D-7 | all slots of D, D-1, D-7 | 7 dummies |
 * | `hourly-profile` (sub-hourly data) | 24 hourly means of D-1, D-2, D-3, D-7, and the period's own slot of each | the same for D, D-1, D-7 | 7 dummies |
 * | `recent-profile` | 24 hourly means of D-1; own slot of D-1, D-2, D-3, D-7 | 24 hourly means of D; own slot of D, D-1, D-7 | 7 dummies |
 * | `own-period` | own slot of D-1, D-2, D-3, D-7; last hour of D-1 | own slot of D, D-1, D-7 | 7 dummies |
 * | `own-period-short` | own slot of D-1, D-2, D-3; last hour of D-1 | own slot of D, D-1 | – |
 * | `minimal` | own slot of D-1, D-2; last hour of D-1 | own slot of D | – |
 *
 * Only `published` shares one input set across all periods (one Gram matrix
 * per day for all of them); the others add the period's own slot. At hourly
 * resolution an hourly mean is the slot itself, and a repeated input is
 * kept once.
 */
export type LearLevel = 'published' | 'hourly-profile' | 'recent-profile' | 'own-period' | 'own-period-short' | 'minimal';

export const LEAR_LEVELS: readonly LearLevel[] = ['published', 'hourly-profile', 'recent-profile', 'own-period', 'own-period-short', 'minimal'];

export const DAYS_PER_INPUT = 2;

/** One input column: the mean of `source` over slots from..to-1 of day D-lag, or a weekday dummy. */
export interface LearInput {
  key: string;
  /** 'price', a driver name, or 'weekday' */
  source: string;
  lag: number;
  from: number;
  to: number;
  /** ISO weekday 1..7 for a dummy */
  weekday?: number;
}

export interface LearDesign {
  level: LearLevel;
  /** every distinct input used by some period */
  inputs: LearInput[];
  /** per period, indices into `inputs` */
  byPeriod: number[][];
  /** the largest lag (days) any input reads */
  maxLag: number;
}

const PRICE_LAGS = [1, 2, 3, 7];
const DRIVER_LAGS = [0, 1, 7];

/** The inputs of every period at a level, for `slots` periods a day and the named drivers. */
export function learDesign(level: LearLevel, slots: number, drivers: string[]): LearDesign {
  const perHour = slots / 24;
  const inputs: LearInput[] = [];
  const index = new Map<string, number>();
  let seen = new Set<number>();
  const use = (list: number[], source: string, lag: number, from: number, to: number, weekday?: number) => {
    const key = weekday ? `weekday ${weekday}` : `${source} D-${lag} ${from}-${to}`;
    let i = index.get(key);
    if (i === undefined) {
      i = inputs.length;
      index.set(key, i);
      inputs.push({ key, source, lag, from, to, weekday });
    }
    if (!seen.has(i)) { seen.add(i); list.push(i); }
  };
  const allSlots = (list: number[], source: string, lag: number) => { for (let s = 0; s < slots; s++) use(list, source, lag, s, s + 1); };
  const hours = (list: number[], source: string, lag: number) => { for (let j = 0; j < 24; j++) use(list, source, lag, j * perHour, (j + 1) * perHour); };
  const own = (list: number[], source: string, lag: number, h: number) => use(list, source, lag, h, h + 1);
  const lastHour = (list: number[]) => use(list, 'price', 1, slots - perHour, slots);
  const dummies = (list: number[]) => { for (let w = 1; w <= 7; w++) use(list, 'weekday', 0, 0, 0, w); };

  const byPeriod: number[][] = [];
  for (let h = 0; h < slots; h++) {
    const list: number[] = [];
    seen = new Set();
    switch (level) {
      case 'published':
        for (const lag of PRICE_LAGS) allSlots(list, 'price', lag);
        for (const d of drivers) for (const lag of DRIVER_LAGS) allSlots(list, d, lag);
        dummies(list);
        break;
      case 'hourly-profile':
        for (const lag of PRICE_LAGS) { hours(list, 'price', lag); own(list, 'price', lag, h); }
        for (const d of drivers) for (const lag of DRIVER_LAGS) { hours(list, d, lag); own(list, d, lag, h); }
        dummies(list);
        break;
      case 'recent-profile':
        hours(list, 'price', 1);
        for (const lag of PRICE_LAGS) own(list, 'price', lag, h);
        for (const d of drivers) { hours(list, d, 0); for (const lag of DRIVER_LAGS) own(list, d, lag, h); }
        dummies(list);
        break;
      case 'own-period':
        for (const lag of PRICE_LAGS) own(list, 'price', lag, h);
        lastHour(list);
        for (const d of drivers) for (const lag of DRIVER_LAGS) own(list, d, lag, h);
        dummies(list);
        break;
      case 'own-period-short':
        for (const lag of [1, 2, 3]) own(list, 'price', lag, h);
        lastHour(list);
        for (const d of drivers) for (const lag of [0, 1]) own(list, d, lag, h);
        break;
      case 'minimal':
        for (const lag of [1, 2]) own(list, 'price', lag, h);
        lastHour(list);
        for (const d of drivers) own(list, d, 0, h);
        break;
    }
    byPeriod.push(list);
  }
  const maxLag = Math.max(...inputs.map((x) => x.lag));
  return { level, inputs, byPeriod, maxLag };
}

/** The value of an input for target day t (NaN where a needed row is unknown or missing). */
export function inputValue(view: DayFrame, input: LearInput, t: number, weekdayOf: (t: number) => number): number {
  if (input.weekday) return weekdayOf(t) === input.weekday ? 1 : 0;
  const rows = input.source === 'price' ? view.price : view.drivers[input.source];
  const row = rows?.[t - input.lag];
  if (!row) return NaN;
  let sum = 0;
  for (let s = input.from; s < input.to; s++) sum += row[s];
  return sum / (input.to - input.from);
}

/** Inputs per period of the published set: 4 price lags and 3 lags per driver at every slot, 7 dummies. */
export function publishedInputCount(slots: number, drivers: number): number {
  return 4 * slots + 3 * drivers * slots + 7;
}

/** Largest input count of any period. */
export function widestPeriod(design: LearDesign): number {
  return Math.max(...design.byPeriod.map((l) => l.length));
}
