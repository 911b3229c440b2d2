import { describe, expect, it } from 'vitest';
import type { Job, Reply } from '../../src/pane/jobs/protocol';
import { startJob } from '../../src/pane/jobs/worker-client';

/** A stand-in for a Web Worker: the test decides what it posts and when. */
class FakeWorker {
  onmessage: ((e: MessageEvent<Reply>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  posted: unknown[] = [];
  terminated = 0;
  postMessage(m: unknown) { this.posted.push(m); }
  terminate() { this.terminated++; }
  reply(r: Reply) { this.onmessage?.({ data: r } as MessageEvent<Reply>); }
}

const job = { type: 'backtest', series: { times: [], price: [], drivers: {}, resolution: 60, zone: 'UTC' }, settings: null, label: 'x', days: 1 } as Job;

describe('startJob(job, onProgress, makeWorker)', () => {
  it('posts the job, passes progress on, resolves with the one result and terminates the worker', async () => {
    const w = new FakeWorker();
    const seen: number[] = [];
    const running = startJob(job, (p) => seen.push(p.fraction), () => w as unknown as Worker);
    expect(w.posted).toEqual([job]);
    w.reply({ type: 'progress', fraction: 0.5, what: 'forecast days', done: 1, total: 2 });
    w.reply({ type: 'failed', message: 'no' });
    w.reply({ type: 'progress', fraction: 0.9, what: 'late', done: 2, total: 2 });
    expect(await running.result).toEqual({ type: 'failed', message: 'no' });
    expect(seen).toEqual([0.5]);
    expect(w.terminated).toBe(1);
  });

  it('cancel terminates the worker at once and ignores anything it still posts', async () => {
    const w = new FakeWorker();
    const running = startJob(job, () => {}, () => w as unknown as Worker);
    running.cancel();
    w.reply({ type: 'trained', text: '{}', seconds: 1 });
    expect(await running.result).toEqual({ type: 'cancelled' });
    expect(w.terminated).toBe(1);
  });

  it('turns a crash of the worker into one failed result', async () => {
    const w = new FakeWorker();
    const running = startJob(job, () => {}, () => w as unknown as Worker);
    w.onerror?.({ message: 'out of memory', preventDefault() {} } as ErrorEvent);
    expect(await running.result).toEqual({ type: 'failed', message: 'the training worker stopped: out of memory' });
  });
});
