import { InputError } from '../errors';
import type { DayFrame } from '../series/day-frame';

/**
 * The plausibility rule for input prices: a model refuses to forecast from a
 * price further than `REACH` times the width of its training range beyond
 * that range, taking it for a typing or unit slip (48000 typed for 48).
 * The rule is deliberately wide: genuine spikes, negative hours and a level
 * that doubles or trebles within weeks all pass; only a value no market of
 * the training kind could print is stopped. Measured on the training span
 * (and widened by every update), so a market that really moves on is
 * followed once the model has learnt its new days.
 *
 * Common practice for hand-kept data: check inputs against the range seen
 * before, and refuse rather than return a plausible-looking wrong number.
 *
 * @example priceBounds(range) // { lo: -580, hi: 750 } for a training range of -10 … 180
 */
export interface PriceRange {
  lo: number;
  hi: number;
}

export const REACH = 3;

/** Lowest and highest known price of the rows; undefined when none is known. */
export function priceRangeOf(rows: ArrayLike<ArrayLike<number>>): PriceRange | undefined {
  let lo = Infinity, hi = -Infinity;
  for (let d = 0; d < rows.length; d++) {
    const row = rows[d];
    for (let k = 0; k < row.length; k++) {
      const v = row[k];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return lo <= hi ? { lo, hi } : undefined;
}

export function widenRange(a: PriceRange, b: PriceRange | undefined): PriceRange {
  return b ? { lo: Math.min(a.lo, b.lo), hi: Math.max(a.hi, b.hi) } : a;
}

export function priceBounds({ lo, hi }: PriceRange): PriceRange {
  // a flat training range (a capped price) still leaves room of 10 % of its level
  const span = Math.max(hi - lo, 0.1 * Math.max(Math.abs(lo), Math.abs(hi)), 1);
  return { lo: lo - REACH * span, hi: hi + REACH * span };
}

/**
 * Throws for the first price of rows `from` … `to` − 1 of `view` outside
 * the bounds of `range`, naming its delivery day and clock time.
 */
export function checkInputPrices(view: DayFrame, from: number, to: number, range: PriceRange, forDay: string): void {
  const { lo, hi } = priceBounds(range);
  for (let d = Math.max(0, from); d < Math.min(to, view.price.length); d++) {
    const row = view.price[d];
    for (let k = 0; k < row.length; k++) {
      const v = row[k];
      if (v < lo || v > hi) {
        throw new InputError(
          `cannot forecast ${forDay}: the price of ${view.days[d].date} ${clockTime(k, view.resolution)} is ${v}, far outside the ${round(range.lo)} to ${round(range.hi)} the model was trained on; check that value (or retrain if prices really moved this far)`,
        );
      }
    }
  }
}

function clockTime(slot: number, resolution: number): string {
  const minutes = slot * resolution;
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

function round(v: number): string {
  return Number(v.toPrecision(4)).toString();
}
