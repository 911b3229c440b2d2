import type { PaneContext } from '../context';
import { clear, guarded, h, messageLine } from '../dom';
import { modelFacts, type ShelfEntry } from '../logic/model-shelf';

/**
 * Models: what is saved in this workbook, with the facts a desk asks about
 * (trained range, resolution, validation MAE, created), and rename and
 * delete, each confirmed in the pane's dialog.
 */
export function modelsSection(ctx: PaneContext): HTMLElement {
  const { store } = ctx;
  const message = messageLine('models-message');
  const list = h('ul', { class: 'loom-models', test: 'model-list' });

  const item = (m: ShelfEntry): HTMLElement => {
    const renameInput = h('input', { type: 'text', test: 'rename-input', value: m.name, hidden: true });
    const renameSave = h('button', { class: 'loom-button loom-button-small', type: 'button', test: 'rename-save', text: 'Save name', hidden: true });
    const rename = h('button', { class: 'loom-button loom-button-small', type: 'button', test: 'rename-button', text: 'Rename' });
    const remove = h('button', { class: 'loom-button loom-button-small loom-button-danger', type: 'button', test: 'delete-button', text: 'Delete' });
    const use = h('button', { class: 'loom-button loom-button-small', type: 'button', test: 'use-model-button', text: 'Use' });
    rename.addEventListener('click', () => { renameInput.hidden = false; renameSave.hidden = false; renameInput.focus(); renameInput.select(); });
    renameSave.addEventListener('click', () => guarded(renameSave, message, async () => {
      const to = renameInput.value.trim();
      if (to === m.name) { renameInput.hidden = true; renameSave.hidden = true; return; }
      if (await ctx.shelf.rename(m.name, to, ctx.ask)) {
        await ctx.refreshModels();
        if (store.get().selected === m.name) store.set({ selected: to });
        message.ok(`Renamed "${m.name}" to "${to}".`);
      }
    }));
    remove.addEventListener('click', () => guarded(remove, message, async () => {
      if (await ctx.shelf.remove(m.name, ctx.ask)) {
        await ctx.refreshModels();
        message.ok(`Deleted "${m.name}".`);
      }
    }));
    use.addEventListener('click', () => { store.set({ selected: m.name }); message.ok(`Check and Place now use "${m.name}".`); });
    const facts = m.stored
      ? h('dl', { class: 'loom-facts' }, ...modelFacts(m.stored).flatMap((f) => [h('dt', { text: f.label }), h('dd', { text: f.value, data: { fact: f.label } })]))
      : h('p', { class: 'loom-msg loom-msg-error', text: m.problem ?? 'cannot be read' });
    const selected = store.get().selected === m.name;
    return h('li', { class: selected ? 'loom-model loom-model-selected' : 'loom-model', test: 'model-item', data: { model: m.name } },
      h('div', { class: 'loom-model-head' }, h('strong', { text: m.name, test: 'model-name-label' }), selected ? h('span', { class: 'loom-tag', text: 'in use' }) : null),
      facts,
      h('div', { class: 'loom-actions' }, m.stored ? use : null, rename, remove, renameInput, renameSave),
    );
  };

  const render = () => {
    clear(list);
    const { models } = store.get();
    if (models.length === 0) list.appendChild(h('li', { class: 'loom-empty', text: 'No model is saved in this workbook yet. Train one in Train.' }));
    for (const m of models) list.appendChild(item(m));
  };
  store.subscribe((st, prev) => { if (st.models !== prev.models || st.selected !== prev.selected) render(); });
  render();

  const reload = h('button', { class: 'loom-button', type: 'button', test: 'models-refresh', text: 'Reload list' });
  reload.addEventListener('click', () => guarded(reload, message, async () => { await ctx.refreshModels(); message.clear(); }));

  return h('section', { class: 'loom-section', test: 'section-models', data: { section: 'models' } },
    h('h2', { text: 'Models' }),
    h('p', { class: 'loom-intro', text: 'Models travel inside this workbook, so its LOOM cells recompute wherever it is opened with the add-in.' }),
    list,
    h('div', { class: 'loom-actions' }, reload),
    message.el,
  );
}
