import { InputError } from '../errors';
import { frameBefore, type DayFrame } from '../series/day-frame';
import { calibrateLear, DEFAULT_LEAR_SETTINGS, LEAR_MIN_HISTORY_DAYS, predictLear, type LearCalibration } from './lear-calibrate';

/**
 * LEAR (lear-calibrate.ts) as the third part of the blend. The published
 * benchmark recalibrates every day; inside the blend it recalibrates every
 * LEAR_REFRESH_DAYS days (a calibration costs about as much as the rest of
 * the blend's daily update together; npm run bench measured the weekly
 * rhythm within 1 % of the daily one on the bench markets' blend MAE) and
 * forecasts each day from the newest calibration made before it.
 */
export const LEAR_REFRESH_DAYS = 7;

/** LEAR's forecasts for days `days` (ascending indices of `view`), each from a calibration on days before it only; undefined where none can be made. */
export function learBlockForecasts(view: DayFrame, days: number[]): (Float64Array | undefined)[] {
  let cal: LearCalibration | undefined;
  let calibratedAt = -Infinity;
  return days.map((d) => {
    if (d < LEAR_MIN_HISTORY_DAYS) return undefined;
    const before = frameBefore(view, d);
    if (d - calibratedAt >= LEAR_REFRESH_DAYS) {
      cal = calibrateLear(before, DEFAULT_LEAR_SETTINGS);
      calibratedAt = d;
    }
    return learPoint(cal, before);
  });
}

/** A calibration on every day of `view`, or undefined when the history is too short. */
export function learOnAll(view: DayFrame): LearCalibration | undefined {
  return view.price.length >= LEAR_MIN_HISTORY_DAYS ? calibrateLear(view, DEFAULT_LEAR_SETTINGS) : undefined;
}

/** LEAR's point forecast of the view's target day, or undefined when an input it needs is unknown. */
export function learPoint(cal: LearCalibration | undefined, view: DayFrame): Float64Array | undefined {
  if (!cal) return undefined;
  try {
    return predictLear(cal, view).point;
  } catch (err) {
    if (err instanceof InputError) return undefined;
    throw err;
  }
}
