/// <reference lib="webworker" />
import type { Job, Reply } from './jobs/protocol';
import { runJob } from './jobs/run-job';

/**
 * The training worker: receives one Job, posts progress and one result
 * (jobs/protocol.ts). Training runs here so the pane stays responsive; the
 * pane cancels by terminating this worker, which discards everything it
 * held, so a cancelled training leaves nothing behind.
 */
const scope = self as unknown as { onmessage: ((event: MessageEvent<Job>) => void) | null; postMessage(reply: Reply): void };

scope.onmessage = (event) => {
  runJob(event.data, (reply) => scope.postMessage(reply));
};
