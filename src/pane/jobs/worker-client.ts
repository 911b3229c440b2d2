import type { Job, ProgressReply, Reply } from './protocol';

/** Starts a worker; the pane's default is makeTrainWorker (make-worker.ts). */
export type WorkerFactory = () => Worker;

export interface RunningJob {
  /** the job's one result: trained, backtested, failed, or cancelled */
  result: Promise<Exclude<Reply, ProgressReply> | { type: 'cancelled' }>;
  /** stops the job at once: the worker is terminated and its work thrown away */
  cancel(): void;
}

/**
 * Runs a job in a fresh worker, one worker per job, terminated when the
 * job ends or is cancelled.
 */
export function startJob(job: Job, onProgress: (p: ProgressReply) => void, makeWorker: WorkerFactory): RunningJob {
  const worker = makeWorker();
  let settle: (r: Exclude<Reply, ProgressReply> | { type: 'cancelled' }) => void = () => {};
  let done = false;
  const result = new Promise<Exclude<Reply, ProgressReply> | { type: 'cancelled' }>((resolve) => { settle = resolve; });
  const finish = (r: Exclude<Reply, ProgressReply> | { type: 'cancelled' }) => {
    if (done) return;
    done = true;
    worker.terminate();
    settle(r);
  };
  worker.onmessage = (event: MessageEvent<Reply>) => {
    if (done) return;
    const reply = event.data;
    if (reply.type === 'progress') onProgress(reply);
    else finish(reply);
  };
  worker.onerror = (event: ErrorEvent) => {
    event.preventDefault?.();
    finish({ type: 'failed', message: `the training worker stopped: ${event.message || 'unknown error'}` });
  };
  worker.postMessage(job);
  return { result, cancel: () => finish({ type: 'cancelled' }) };
}
