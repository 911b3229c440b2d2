import { parseStoredModel, type StoredModel } from '../../engine';
import type { ModelShelf } from '../logic/model-shelf';
import type { RunningJob } from './worker-client';

export type TrainOutcome =
  | { status: 'saved'; stored: StoredModel; seconds: number }
  | { status: 'cancelled' }
  | { status: 'failed'; message: string }
  | { status: 'not saved' };

/**
 * Waits for a training job and saves its model, and only then: a job that
 * is cancelled or fails leaves the workbook exactly as it was, since the
 * model text exists only in the worker until the one `trained` reply.
 * The text is checked against the stored-model schema before it is saved.
 *
 * @param result the job's result (RunningJob.result)
 * @param replaceConfirmed the user already agreed to replace a model of that name
 */
export async function trainAndSave(result: RunningJob['result'], shelf: ModelShelf, name: string, replaceConfirmed: boolean): Promise<TrainOutcome> {
  const outcome = await result;
  if (outcome.type === 'cancelled') return { status: 'cancelled' };
  if (outcome.type === 'failed') return { status: 'failed', message: outcome.message };
  if (outcome.type !== 'trained') return { status: 'failed', message: 'the worker gave no trained model' };
  const stored = parseStoredModel(outcome.text, 'the trained model');
  const saved = await shelf.save(name, outcome.text, async () => replaceConfirmed);
  return saved ? { status: 'saved', stored: { ...stored, name }, seconds: outcome.seconds } : { status: 'not saved' };
}
