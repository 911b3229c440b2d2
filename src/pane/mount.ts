import './strict-csp';
import type { AskUser, WorkbookPort } from '../host/workbook-port';
import { TABS, type PaneContext, type TabId } from './context';
import { createDialog } from './dialog';
import { h } from './dom';
import type { WorkerFactory } from './jobs/worker-client';
import { CAUTION } from './logic/outlook-layout';
import { shelfOf, type ModelShelf } from './logic/model-shelf';
import { ModelStore } from '../host/model-store';
import { makeTrainWorker } from './make-worker';
import { checkSection } from './sections/check';
import { dataSection } from './sections/data';
import { modelsSection } from './sections/models';
import { placeSection } from './sections/place';
import { trainSection } from './sections/train';
import { Store, type PaneState } from './state';
import { ensurePaneStyles } from './stylesheet';

export interface PaneOptions {
  /** starts the training worker; default: the bundled train-worker */
  makeWorker?: WorkerFactory;
  /** where models are kept; default: the host's ModelStore over `port` (its cache is shared with the cell functions) */
  shelf?: ModelShelf;
  /** pre-filled Data fields, e.g. the demo workbook's ranges in the preview */
  defaults?: { times?: string; prices?: string; drivers?: string[]; zone?: string; region?: string };
  /** the section shown first (default data) */
  tab?: TabId;
  /** the clock in UTC ms (default Date.now), for reproducible screenshots */
  now?: () => number;
  /** link pane.css into the document (default true); false when the page links it itself */
  styles?: boolean;
}

export interface PaneHandle {
  /** the pane's own yes/no dialog, as the AskUser the writes use */
  ask: AskUser;
  showTab(id: TabId): void;
  /** reloads the saved models from the workbook */
  refreshModels(): Promise<void>;
  /** removes the pane from `root` */
  destroy(): void;
}

const TAB_LABELS: Record<TabId, string> = { data: 'Data', train: 'Train', check: 'Check', place: 'Place', models: 'Models' };

/**
 * Mounts the Spotloom task pane into `root`, working against any
 * WorkbookPort: the Office one in the add-in, the in-memory one in the
 * standalone preview. The pane reads and writes the workbook only through
 * the port, and writes cells only through writeWithConsent.
 *
 * @example mountPane(document.getElementById('app')!, memoryWorkbook(demo), { defaults: { times: 'History!A2:A900' } })
 */
export function mountPane(root: HTMLElement, port: WorkbookPort, options: PaneOptions = {}): PaneHandle {
  if (options.styles !== false) ensurePaneStyles(root.ownerDocument);
  const d = options.defaults ?? {};
  const initial: PaneState = {
    choice: { times: d.times ?? '', prices: d.prices ?? '', drivers: d.drivers ?? [] },
    zone: d.zone ?? 'Europe/Berlin',
    region: d.region ?? '',
    models: [],
  };
  const store = new Store(initial);
  const dialog = createDialog();
  const shelf = options.shelf ?? shelfOf(new ModelStore(port));
  const panels = new Map<TabId, HTMLElement>();
  const tabs = new Map<TabId, HTMLButtonElement>();

  const showTab = (id: TabId) => {
    for (const t of TABS) {
      const on = t === id;
      panels.get(t)!.hidden = !on;
      tabs.get(t)!.setAttribute('aria-selected', String(on));
      tabs.get(t)!.tabIndex = on ? 0 : -1;
    }
    pane.setAttribute('data-tab', id);
  };
  const refreshModels = async () => {
    const models = await shelf.list();
    const { selected } = store.get();
    store.set({ models, selected: selected && models.some((m) => m.name === selected) ? selected : models[0]?.name });
  };
  const ctx: PaneContext = {
    port, store, ask: dialog.ask, shelf, makeWorker: options.makeWorker ?? makeTrainWorker,
    now: options.now ?? Date.now, refreshModels, showTab,
  };

  const nav = h('nav', { class: 'loom-tabs', role: 'tablist', aria: { label: 'Spotloom sections' } });
  const main = h('main', { class: 'loom-main' });
  const builders: Record<TabId, (c: PaneContext) => HTMLElement> = {
    data: dataSection, train: trainSection, check: checkSection, place: placeSection, models: modelsSection,
  };
  for (const id of TABS) {
    const panel = builders[id](ctx);
    panel.id = `loom-panel-${id}`;
    panel.setAttribute('role', 'tabpanel');
    panel.setAttribute('aria-labelledby', `loom-tab-${id}`);
    const tab = h('button', {
      class: 'loom-tab', type: 'button', role: 'tab', id: `loom-tab-${id}`, test: `tab-${id}`, text: TAB_LABELS[id],
      aria: { controls: panel.id },
    });
    tab.addEventListener('click', () => showTab(id));
    tab.addEventListener('keydown', (e) => {
      const k = TABS.indexOf(id);
      const next = e.key === 'ArrowRight' ? TABS[(k + 1) % TABS.length] : e.key === 'ArrowLeft' ? TABS[(k + TABS.length - 1) % TABS.length] : undefined;
      if (next) { e.preventDefault(); showTab(next); tabs.get(next)!.focus(); }
    });
    tabs.set(id, tab);
    panels.set(id, panel);
    nav.appendChild(tab);
    main.appendChild(panel);
  }
  const busy = h('span', { class: 'loom-busy', test: 'busy', hidden: true });
  store.subscribe((st) => {
    busy.hidden = !st.busy;
    busy.textContent = st.busy === 'train' ? 'training…' : st.busy === 'backtest' ? 'backtesting…' : '';
  });
  const pane = h('div', { class: 'loom-pane', test: 'pane', data: { host: port.kind } },
    h('header', { class: 'loom-head' },
      h('span', { class: 'loom-brand', text: 'Spotloom' }),
      h('span', { class: 'loom-sub', text: 'day-ahead price forecasts' }),
      busy),
    nav,
    main,
    h('footer', { class: 'loom-caution', test: 'caution', text: CAUTION }),
    dialog.el,
  );
  root.appendChild(pane);
  showTab(options.tab ?? 'data');
  void refreshModels().catch(() => undefined);

  return {
    ask: dialog.ask,
    showTab,
    refreshModels,
    destroy: () => pane.remove(),
  };
}
