import { writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import {
  createModel, dayIndexOf, frameBefore, InputError, inputFrame, Learner, NAME_RULE, StoredName, storedModelText, toStoredModel,
} from '../../engine';
import { dialectChoice, loadSeries, type DialectFlags } from '../load-input';
import { modelOptions, type ModelFlags } from '../model-flags';
import { stderrProgress } from '../progress';

export interface TrainFlags extends ModelFlags, DialectFlags {
  input: string;
  until?: string;
  save: string;
  model: string;
  tz: string;
  missing?: string;
  json?: boolean;
}

export async function trainCommand(flags: TrainFlags): Promise<void> {
  const model = createModel(flags.model, modelOptions(flags));
  if (!(model instanceof Learner)) throw new InputError(`--model ${flags.model} has nothing to train`);
  const { series } = loadSeries(flags.input, flags.tz, 'price', flags.missing, dialectChoice(flags));
  // the model file keeps driver names: refuse one it cannot keep now, not after training
  for (const name of Object.keys(series.drivers)) {
    if (!StoredName.safeParse(name).success) {
      throw new InputError(`column "${name}" cannot be a driver name in a model file, which allows ${NAME_RULE}; rename the column`, { file: flags.input });
    }
  }
  const frame = inputFrame(series);
  let view = frame;
  if (flags.until !== undefined) {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(flags.until)) throw new InputError(`--until "${flags.until}" is not a date YYYY-MM-DD`);
    const idx = dayIndexOf(frame, flags.until);
    if (idx <= 0) throw new InputError(`--until ${flags.until} leaves no training day (the data starts ${frame.days[0].date})`);
    view = frameBefore(frame, Math.min(idx, frame.price.length));
  }
  const started = Date.now();
  model.fit(view, stderrProgress('train'));
  const name = basename(flags.save).replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9_ .-]/g, '_').slice(0, 64) || 'model';
  const stored = toStoredModel(model, { name, zone: series.zone, resolution: series.resolution });
  const text = storedModelText(stored);
  try {
    writeFileSync(flags.save, text);
  } catch (err) {
    throw new InputError(`cannot be written (${(err as NodeJS.ErrnoException).code ?? 'unknown error'})`, { file: flags.save });
  }
  const v = stored.holdout, t = stored.tuning;
  const summary = {
    model: stored.settings.kind, saved: flags.save, kilobytes: Math.round(text.length / 102.4) / 10,
    trained_from: stored.trainedFrom, trained_to: stored.trainedTo, validation_days: v.days,
    validation_mae: v.mae, validation_mae_linear: v.maeLinear, validation_mae_neural: v.maeNeural, validation_mae_lear: v.maeLear ?? null,
    validation_mae_naive_week: v.maeNaiveWeek, tuning_days: t.days, tuning_mae: t.mae, neural_weight: stored.neuralWeight, lear_weight: stored.learWeight ?? 0, linear_members: stored.linear.map((l) => ({ window: l.window, lambda: l.lambda })),
    importance: stored.importance, notes: stored.notes, seconds: (Date.now() - started) / 1000,
  };
  if (flags.json) { process.stdout.write(`${JSON.stringify(summary)}\n`); return; }
  const f = (x: number | null) => (x === null || !Number.isFinite(x) ? 'n/a' : x.toFixed(3));
  process.stdout.write(
    `Saved ${stored.settings.kind} model to ${flags.save} (${summary.kilobytes} KB), trained on ${stored.trainedFrom} to ${stored.trainedTo} in ${summary.seconds.toFixed(1)} s.\n` +
    `Validation on the last ${v.days} training days, which took part in no choice: MAE ${f(v.mae)} (linear ${f(v.maeLinear)}, neural ${f(v.maeNeural)}, lear ${f(v.maeLear ?? null)}, naive-week ${f(v.maeNaiveWeek)}).\n` +
    `Tuning block (${t.days} days before those; penalties, early stopping and the blend weights (neural ${stored.neuralWeight}, lear ${stored.learWeight ?? 0}) were chosen on it): MAE ${f(t.mae)}.\n` +
    `Inputs by importance (validation MAE rise when a group is shuffled): ${stored.importance.map((i) => `${i.group} ${i.increase >= 0 ? '+' : ''}${i.increase.toFixed(2)}`).join(', ')}\n`,
  );
  for (const note of stored.notes) process.stdout.write(`Note: ${note}\n`);
}
