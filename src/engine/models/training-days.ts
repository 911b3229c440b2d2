import { dayFeatures, type FeatureSetup } from '../features/day-features';
import { toScaled, type LevelScale } from '../features/level-scale';
import type { DeliveryDay } from '../series/delivery-days';
import { frameBefore, type DayFrame } from '../series/day-frame';

/** One usable day: its features, its level scale and (when known) its scaled prices. */
export interface TrainingDay {
  day: number;
  x: Float64Array;
  scale: LevelScale;
  /** scaled target prices per slot, undefined for the day being forecast */
  y?: Float64Array;
}

/**
 * Feature vectors per delivery day, computed once. A day's features only
 * read data before it (dayFeatures on frameBefore), so an entry never
 * changes as later days arrive; entries are keyed by the day object, which
 * every view cut from one frame shares.
 */
export class FeatureCache {
  private readonly byDay = new WeakMap<DeliveryDay, ReturnType<typeof dayFeatures> | null>();

  constructor(readonly setup: FeatureSetup) {}

  features(frame: DayFrame, d: number): ReturnType<typeof dayFeatures> {
    const key = frame.days[d];
    const hit = this.byDay.get(key);
    if (hit !== undefined) return hit ?? undefined;
    const f = dayFeatures(frameBefore(frame, d), this.setup);
    this.byDay.set(key, f ?? null);
    return f;
  }

  /** Usable days from `from` to `to` - 1 with known prices as targets. */
  trainingDays(view: DayFrame, from: number, to: number): TrainingDay[] {
    const out: TrainingDay[] = [];
    for (let d = Math.max(0, from); d < Math.min(to, view.price.length); d++) {
      const f = this.features(view, d);
      if (!f) continue;
      const y = view.price[d].map((p) => toScaled(p, f.scale));
      if (y.every(Number.isFinite)) out.push({ day: d, x: f.x, scale: f.scale, y });
    }
    return out;
  }
}
