import { dayFrame, type DayFrame } from './day-frame';
import { fillFromEarlierDays } from './fill-missing';
import type { Series } from './series';

/**
 * The day frame that models read: unknown prices and drivers take the same
 * period of the nearest earlier day (fill-missing.ts). Price rows end with
 * the last day that has any known price, so days still to be forecast are
 * never filled with guesses.
 */
export function inputFrame(series: Series): DayFrame {
  const frame = dayFrame(series);
  let lastPriceDay = frame.price.length - 1;
  while (lastPriceDay >= 0 && frame.price[lastPriceDay].every(Number.isNaN)) lastPriceDay--;
  // a partly known last day counts as known only where it was filled from its own past
  frame.price.length = lastPriceDay + 1;
  fillFromEarlierDays(frame.price);
  for (const rows of Object.values(frame.drivers)) fillFromEarlierDays(rows);
  return frame;
}
