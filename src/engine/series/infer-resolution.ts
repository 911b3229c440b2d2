import { InputError } from '../errors';
import type { Resolution } from './series';

const ALLOWED: Resolution[] = [15, 30, 60];

/**
 * The delivery-period length in minutes: the most common step between
 * consecutive sorted instants. Gaps (longer steps) do not change it.
 *
 * @throws InputError with fewer than 2 periods or when the step is not 15, 30 or 60 minutes.
 * @example inferResolution([0, 3.6e6, 7.2e6]) // 60
 */
export function inferResolution(sortedTimes: number[]): Resolution {
  if (sortedTimes.length < 2) {
    throw new InputError('the resolution can only be found with at least 2 periods');
  }
  const counts = new Map<number, number>();
  for (let i = 1; i < sortedTimes.length; i++) {
    const step = (sortedTimes[i] - sortedTimes[i - 1]) / 60_000;
    counts.set(step, (counts.get(step) ?? 0) + 1);
  }
  let best = 0, bestCount = -1;
  for (const [step, n] of counts) if (n > bestCount || (n === bestCount && step < best)) { best = step; bestCount = n; }
  if (!ALLOWED.includes(best as Resolution)) {
    throw new InputError(`periods are ${best} minutes apart; Spotloom handles 15, 30 or 60 minute delivery periods`);
  }
  return best as Resolution;
}
