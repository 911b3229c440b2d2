import type { PaneContext } from '../context';
import { h } from '../dom';
import type { Job, ProgressReply } from '../jobs/protocol';
import { startJob, type RunningJob } from '../jobs/worker-client';

/**
 * A progress bar with its Cancel button, for a job in the worker. Only one
 * job runs at a time in the pane (state.busy); Cancel terminates the worker.
 */
export interface JobProgress {
  el: HTMLElement;
  cancelButton: HTMLButtonElement;
  run(job: Job, onProgress?: (p: ProgressReply) => void): ReturnType<typeof startJob>['result'];
}

export function jobProgress(ctx: PaneContext, tests: { progress: string; cancel: string; text: string }, kind: 'train' | 'backtest'): JobProgress {
  const bar = h('progress', { class: 'loom-progress', test: tests.progress, max: '1', value: '0' });
  bar.setAttribute('data-value', '0');
  const label = h('span', { class: 'loom-progress-text', test: tests.text, text: '' });
  const cancelButton = h('button', { class: 'loom-button', type: 'button', test: tests.cancel, text: 'Cancel', disabled: true });
  let running: RunningJob | undefined;
  cancelButton.addEventListener('click', () => running?.cancel());
  const el = h('div', { class: 'loom-job', hidden: true }, h('div', { class: 'loom-job-row' }, bar, cancelButton), label);

  const setBar = (fraction: number, text: string) => {
    const v = Math.max(0, Math.min(1, fraction));
    bar.value = v;
    bar.setAttribute('data-value', v.toFixed(3));
    label.textContent = text;
  };

  return {
    el,
    cancelButton,
    async run(job, onProgress) {
      if (ctx.store.get().busy) return { type: 'failed', message: `wait for the ${ctx.store.get().busy} that is running, or cancel it` };
      ctx.store.set({ busy: kind });
      el.hidden = false;
      cancelButton.disabled = false;
      setBar(0, 'starting…');
      try {
        running = startJob(job, (p) => {
          setBar(p.fraction, `${Math.round(p.fraction * 100)} % · ${p.what}${p.what === 'network epochs' || p.what === 'forecast days' ? ` ${p.done} of ${p.total}` : ''}`);
          onProgress?.(p);
        }, ctx.makeWorker);
        const result = await running.result;
        setBar(result.type === 'cancelled' || result.type === 'failed' ? bar.value : 1,
          result.type === 'cancelled' ? 'cancelled' : result.type === 'failed' ? 'stopped' : 'done');
        return result;
      } finally {
        running = undefined;
        cancelButton.disabled = true;
        ctx.store.set({ busy: undefined });
      }
    },
  };
}
