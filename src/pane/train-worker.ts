/// <reference lib="webworker" />
import { prepareHolidays } from '../engine';
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
  const post = (reply: Reply) => scope.postMessage(reply);
  // the holiday rules of the job's region load first (one chunk per country in the browser build)
  prepareHolidays(event.data.settings?.region).then(
    () => runJob(event.data, post),
    (error) => post({ type: 'failed', message: `the holiday rules could not be loaded: ${error instanceof Error ? error.message : String(error)}` }),
  );
};
