import { InputError } from '../errors';
import type { DayFrame } from '../series/day-frame';
import { calibrateLear, DEFAULT_LEAR_SETTINGS, LEAR_MIN_HISTORY_DAYS, predictLear, type LearCalibration, type LearSettings } from './lear-calibrate';
import type { DayAheadModel, DayForecast, Progress } from './model';

/**
 * `--model lear`: the LASSO-estimated auto-regressive benchmark of Lago,
 * Marcjasz, De Schutter & Weron (2021) as a DayAheadModel (method and
 * choices: lear-calibrate.ts, inputs: lear-features.ts). `fit` and `update`
 * recalibrate on the view's window, `predict` applies the last calibration
 * to the view's target day, so the default daily update (defaultRetrainEvery
 * 1) is the published daily recalibration. Point forecasts only: lower and
 * upper stay undefined.
 *
 * @example
 *   const lear = new Lear();
 *   lear.fit(frameBefore(frame, d));
 *   lear.predict(frameBefore(frame, d)).point // one forecast per clock slot
 */
export class Lear implements DayAheadModel {
  readonly name = 'lear';
  readonly minHistoryDays = LEAR_MIN_HISTORY_DAYS;
  readonly defaultRetrainEvery = 1;
  private calibration?: LearCalibration;

  constructor(readonly settings: LearSettings = DEFAULT_LEAR_SETTINGS) {}

  fit(view: DayFrame, progress?: Progress): void {
    this.calibration = calibrateLear(view, this.settings, progress);
  }

  update(view: DayFrame, progress?: Progress): void {
    this.fit(view, progress);
  }

  predict(view: DayFrame): DayForecast {
    if (!this.calibration) throw new InputError('lear: calibrate (fit) before forecasting');
    return predictLear(this.calibration, view);
  }

  /** The last calibration (inputs, penalties, reduction note), for reports. */
  get last(): LearCalibration | undefined {
    return this.calibration;
  }
}
