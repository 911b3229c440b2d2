import type { AskUser } from '../host/workbook-port';
import { h } from './dom';

/**
 * The pane's own yes/no dialog (never window.confirm, which a task pane
 * may not show). Questions queue: one is on screen at a time. "No" has the
 * focus first and Escape answers no, so a hurried Enter never overwrites.
 */
export function createDialog(): { el: HTMLElement; ask: AskUser } {
  const text = h('p', { class: 'loom-dialog-text', test: 'confirm-text', id: 'loom-confirm-text' });
  const yes = h('button', { class: 'loom-button loom-button-main', test: 'confirm-yes', type: 'button', text: 'Yes' });
  const no = h('button', { class: 'loom-button', test: 'confirm-no', type: 'button', text: 'No' });
  const box = h('div', { class: 'loom-dialog-box', role: 'alertdialog', aria: { modal: 'true', describedby: 'loom-confirm-text' } },
    h('p', { class: 'loom-dialog-title', text: 'Please confirm' }), text, h('div', { class: 'loom-dialog-buttons' }, no, yes));
  const el = h('div', { class: 'loom-dialog', test: 'confirm-dialog', hidden: true }, box);

  let chain: Promise<unknown> = Promise.resolve();
  const showOne = (question: string) => new Promise<boolean>((resolve) => {
    text.textContent = question;
    el.hidden = false;
    const done = (answer: boolean) => {
      el.hidden = true;
      yes.removeEventListener('click', onYes);
      no.removeEventListener('click', onNo);
      el.removeEventListener('keydown', onKey);
      resolve(answer);
    };
    const onYes = () => done(true);
    const onNo = () => done(false);
    const onKey = (e: KeyboardEvent) => { if (e.key === 'Escape') { e.preventDefault(); done(false); } };
    yes.addEventListener('click', onYes);
    no.addEventListener('click', onNo);
    el.addEventListener('keydown', onKey);
    no.focus();
  });
  const ask: AskUser = (question) => {
    const next = chain.then(() => showOne(question));
    chain = next.catch(() => undefined);
    return next;
  };
  return { el, ask };
}
