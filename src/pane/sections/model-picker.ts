import { InputError } from '../../engine';
import type { PaneContext } from '../context';
import { clear, h } from '../dom';
import type { ShelfEntry } from '../logic/model-shelf';

/**
 * A select of the models saved in this workbook, kept in step with the
 * store: picking one here picks it for Check and Place alike.
 */
export function modelPicker(ctx: PaneContext, test: string): { el: HTMLSelectElement; current(): ShelfEntry } {
  const { store } = ctx;
  const el = h('select', { test });
  const render = () => {
    const { models, selected } = store.get();
    clear(el);
    if (models.length === 0) el.appendChild(h('option', { value: '', text: 'no model saved yet: train one first' }));
    for (const m of models) el.appendChild(h('option', { value: m.name, text: m.problem ? `${m.name} (unreadable)` : m.name }));
    el.value = selected && models.some((m) => m.name === selected) ? selected : models[0]?.name ?? '';
  };
  el.addEventListener('change', () => store.set({ selected: el.value }));
  store.subscribe((st, prev) => { if (st.models !== prev.models || st.selected !== prev.selected) render(); });
  render();
  return {
    el,
    current() {
      const entry = store.get().models.find((m) => m.name === el.value);
      if (!entry) throw new InputError('no model is picked: train one in Train, or pick a saved one');
      if (!entry.stored) throw new InputError(entry.problem ?? `model "${entry.name}" cannot be read`);
      return entry;
    },
  };
}
