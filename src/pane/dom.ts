import { InputError } from '../engine';

/**
 * A few DOM helpers, so sections read as layout rather than plumbing. Text
 * always goes in as text (textContent), never as HTML, and no inline style
 * attribute is ever written: looks come from classes in pane.css, so the
 * pane runs under a Content-Security-Policy without 'unsafe-inline'.
 */
export type Child = Node | string | number | null | undefined | false;

export interface Attrs {
  class?: string;
  id?: string;
  /** the stable `data-test` hook for end-to-end tests */
  test?: string;
  text?: string;
  title?: string;
  type?: string;
  value?: string;
  name?: string;
  for?: string;
  placeholder?: string;
  role?: string;
  disabled?: boolean;
  checked?: boolean;
  hidden?: boolean;
  list?: string;
  min?: string;
  max?: string;
  step?: string;
  data?: Record<string, string>;
  aria?: Record<string, string>;
  on?: { [K in keyof HTMLElementEventMap]?: (event: HTMLElementEventMap[K]) => void };
}

export function h<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Attrs = {}, ...children: Child[]): HTMLElementTagNameMap[K] {
  const el = document.createElement(tag);
  if (attrs.class) el.className = attrs.class;
  if (attrs.id) el.id = attrs.id;
  if (attrs.test) el.setAttribute('data-test', attrs.test);
  if (attrs.title) el.title = attrs.title;
  if (attrs.role) el.setAttribute('role', attrs.role);
  if (attrs.type) el.setAttribute('type', attrs.type);
  if (attrs.name) el.setAttribute('name', attrs.name);
  if (attrs.for) el.setAttribute('for', attrs.for);
  if (attrs.placeholder) el.setAttribute('placeholder', attrs.placeholder);
  if (attrs.list) el.setAttribute('list', attrs.list);
  if (attrs.min !== undefined) el.setAttribute('min', attrs.min);
  if (attrs.max !== undefined) el.setAttribute('max', attrs.max);
  if (attrs.step !== undefined) el.setAttribute('step', attrs.step);
  if (attrs.value !== undefined) (el as HTMLInputElement).value = attrs.value;
  if (attrs.disabled) (el as HTMLButtonElement).disabled = true;
  if (attrs.checked) (el as HTMLInputElement).checked = true;
  if (attrs.hidden) el.hidden = true;
  for (const [k, v] of Object.entries(attrs.data ?? {})) el.setAttribute(`data-${k}`, v);
  for (const [k, v] of Object.entries(attrs.aria ?? {})) el.setAttribute(`aria-${k}`, v);
  for (const [event, handler] of Object.entries(attrs.on ?? {})) el.addEventListener(event, handler as EventListener);
  if (attrs.text !== undefined) el.textContent = attrs.text;
  append(el, ...children);
  return el;
}

export function append(parent: Node, ...children: Child[]): void {
  for (const c of children) {
    if (c === null || c === undefined || c === false) continue;
    parent.appendChild(typeof c === 'string' || typeof c === 'number' ? document.createTextNode(String(c)) : c);
  }
}

export function clear(el: Element): void {
  while (el.firstChild) el.removeChild(el.firstChild);
}

/** One line for the user from anything thrown: an InputError's own message, else a short note. */
export function errorLine(error: unknown): string {
  if (error instanceof InputError) return error.message;
  const text = error instanceof Error ? error.message : String(error);
  return `Something went wrong: ${text.split('\n')[0]}`;
}

/** A message line that shows one status: plain, good news, or a problem. */
export interface MessageLine {
  el: HTMLElement;
  info(text: string): void;
  ok(text: string): void;
  error(errorOrText: unknown): void;
  clear(): void;
}

export function messageLine(test: string): MessageLine {
  const el = h('p', { class: 'loom-msg', test, role: 'status', aria: { live: 'polite' } });
  const set = (kind: string, text: string) => {
    el.className = `loom-msg loom-msg-${kind}`;
    el.setAttribute('data-kind', kind);
    el.textContent = text;
  };
  return {
    el,
    info: (t) => set('info', t),
    ok: (t) => set('ok', t),
    error: (e) => set('error', typeof e === 'string' ? e : errorLine(e)),
    clear: () => set('none', ''),
  };
}

/** A labelled form row with its one-line explanation underneath. */
export function field(label: string, control: HTMLElement, help?: string, ...extra: Child[]): HTMLElement {
  const id = control.id || `loom-${Math.random().toString(36).slice(2, 9)}`;
  control.id = id;
  return h('div', { class: 'loom-field' },
    h('label', { for: id, class: 'loom-label', text: label }),
    h('div', { class: 'loom-control' }, control, ...extra),
    help ? h('p', { class: 'loom-help', text: help }) : null,
  );
}

/** A count with its noun in the right number: count(1, 'day') is '1 day', count(3, 'day') '3 days'. */
export function count(n: number, noun: string, plural = `${noun}s`): string {
  return `${n} ${n === 1 ? noun : plural}`;
}

/** Formats a number for tables: fixed decimals, "n/a" for unknown. */
export function fmt(x: number | null | undefined, digits = 2): string {
  return x === null || x === undefined || !Number.isFinite(x) ? 'n/a' : x.toFixed(digits);
}

/** Runs an async action with its button disabled, reporting errors on `line`. */
export async function guarded(button: HTMLButtonElement | null, line: MessageLine, action: () => Promise<void>): Promise<void> {
  if (button) button.disabled = true;
  try {
    await action();
  } catch (error) {
    line.error(error);
  } finally {
    if (button) button.disabled = false;
  }
}
