import type { AskUser, WorkbookPort } from '../host/workbook-port';
import type { WorkerFactory } from './jobs/worker-client';
import type { ModelShelf } from './logic/model-shelf';
import type { Store } from './state';

export const TABS = ['data', 'train', 'check', 'place', 'models'] as const;
export type TabId = (typeof TABS)[number];

/** What every section gets from mountPane. */
export interface PaneContext {
  port: WorkbookPort;
  store: Store;
  ask: AskUser;
  shelf: ModelShelf;
  makeWorker: WorkerFactory;
  /** the clock (UTC ms), injectable for tests and screenshots */
  now: () => number;
  refreshModels(): Promise<void>;
  showTab(id: TabId): void;
}
