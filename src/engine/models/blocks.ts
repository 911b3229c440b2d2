/**
 * How a training span is cut, oldest first, into three chronological blocks:
 *
 *   fit      the days the models learn from
 *   tuning   the days every choice is made on: ridge penalties, the
 *            networks' early stopping, the blend weight
 *   holdout  the newest days, which take part in no choice at all; the
 *            model's reported error and the errors its bands start from
 *            come from here, so they are out-of-sample in the full sense
 *
 * Afterwards the stored model is refitted on every day (the linear part
 * exactly, the networks by a short warm start), so it does not lose its
 * newest days. Each block is 15 % of the usable days, at least 14 and at
 * most 91 (common practice: a quarter of data for choices and testing, with
 * a floor so a score rests on two weeks at least and a cap so a long
 * history keeps most of its days for fitting). A short history, where two
 * weeks each would leave too little to fit on, gives each a fifth of its
 * days instead (4 of 20, 6 of 32).
 *
 * @example trainingBlocks(900) // { fit: 718, tuning: 91, holdout: 91 }
 */
export interface TrainingBlocks {
  fit: number;
  tuning: number;
  holdout: number;
}

const SHARE = 0.15;
const FLOOR = 14;
const SHORT_SHARE = 0.2;
const CAP = 91;

export function trainingBlocks(days: number, tuningDays = 0): TrainingBlocks {
  const auto = Math.min(CAP, Math.max(Math.min(FLOOR, Math.round(days * SHORT_SHARE)), Math.round(days * SHARE)));
  const tuning = tuningDays || auto;
  const holdout = auto;
  return { fit: days - tuning - holdout, tuning, holdout };
}
