import type { BacktestOutcome } from './jobs/protocol';
import type { ArchiveGrade } from './logic/grade-archive';
import type { ShelfEntry } from './logic/model-shelf';
import type { DataCheck, RangeChoice } from './logic/read-ranges';

/** What the sections share. One store; sections subscribe to it. */
export interface PaneState {
  choice: RangeChoice;
  zone: string;
  region: string;
  /** the last successful "Check data"; cleared when a range, zone or region changes */
  data?: DataCheck;
  models: ShelfEntry[];
  /** the model Check and Place work with */
  selected?: string;
  backtest?: { model: string; outcome: BacktestOutcome };
  grades?: ArchiveGrade[];
  /** the job running in the worker, if any (one at a time) */
  busy?: 'train' | 'backtest';
}

export type Listener = (state: PaneState, previous: PaneState) => void;

export class Store {
  private state: PaneState;
  private readonly listeners = new Set<Listener>();

  constructor(initial: PaneState) {
    this.state = initial;
  }

  get(): PaneState {
    return this.state;
  }

  set(patch: Partial<PaneState>): void {
    const previous = this.state;
    this.state = { ...previous, ...patch };
    for (const l of [...this.listeners]) l(this.state, previous);
  }

  subscribe(listener: Listener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }
}
