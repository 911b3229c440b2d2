import {
  InputError, learnerFromStored, parseStoredModel, prepareHolidays, storedModelText, toStoredModel,
  type Learner, type Resolution, type StoredModel,
} from '../engine';
import type { WorkbookPort } from './workbook-port';

/**
 * The models saved in a workbook: save, list, rename, delete and load them
 * through the WorkbookPort. Every text read back goes through the engine's
 * parseStoredModel (size cap, JSON, schema) and learnerFromStored (array
 * sizes, finite weights) before anything uses it; a text that fails is
 * listed with its problem, so the user can delete it, and never loaded.
 *
 * Loaded models are cached per workbook in a module-level map, name →
 * { stored, learner }, which the task pane and the cell functions share in
 * the shared runtime; every change made through a ModelStore updates it.
 */
export interface LoadedModel {
  name: string;
  stored: StoredModel;
  learner: Learner;
}

export interface ListedModel {
  name: string;
  /** the validated model, when it passed */
  stored?: StoredModel;
  /** why it was refused, when it did not */
  problem?: string;
}

const caches = new WeakMap<WorkbookPort, Map<string, Promise<LoadedModel>>>();

export class ModelStore {
  constructor(readonly port: WorkbookPort) {}

  /** Every saved model, validated, sorted by name. */
  async list(): Promise<ListedModel[]> {
    const texts = await this.port.loadModels();
    return Object.entries(texts)
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([name, text]) => {
        try {
          const { stored } = check(name, text);
          return { name, stored };
        } catch (err) {
          return { name, problem: err instanceof Error ? err.message : String(err) };
        }
      });
  }

  async has(name: string): Promise<boolean> {
    return Object.prototype.hasOwnProperty.call(await this.port.loadModels(), name);
  }

  /**
   * The model saved under `name`, validated and ready; cached.
   * @throws InputError when there is none or its text does not pass the checks
   */
  async load(name: string): Promise<LoadedModel> {
    if (typeof name !== 'string' || name.trim() === '') throw new InputError('give the name of a model saved in this workbook');
    const cache = this.cache();
    let hit = cache.get(name);
    if (!hit) {
      hit = this.port.loadModels().then(async (texts) => {
        if (!Object.prototype.hasOwnProperty.call(texts, name)) throw new InputError(missing(name, Object.keys(texts)));
        const loaded = { name, ...check(name, texts[name]) };
        await prepareHolidays(loaded.stored.setup.region); // its holiday features need the region's rules
        return loaded;
      });
      cache.set(name, hit);
      hit.catch(() => cache.delete(name));
    }
    return hit;
  }

  /**
   * Saves a trained learner under `name`.
   * @param replace overwrite a model of that name (the pane asks first)
   * @throws InputError when the name is taken and `replace` is not set, or the name is not allowed
   */
  async save(learner: Learner, meta: { name: string; zone: string; resolution: Resolution; createdAt?: string }, replace = false): Promise<LoadedModel> {
    checkName(meta.name);
    const stored = toStoredModel(learner, meta);
    return this.saveStored(stored, replace, learner);
  }

  /** Saves a model text from elsewhere (a file), after the same checks as a load. */
  async saveText(text: string, replace = false): Promise<LoadedModel> {
    const stored = parseStoredModel(text, 'the model file');
    return this.saveStored(stored, replace);
  }

  async rename(from: string, to: string): Promise<LoadedModel> {
    checkName(to);
    if (from === to) return this.load(from);
    if (await this.has(to)) throw new InputError(`a model named "${to}" is already saved in this workbook; choose another name or delete that one first`);
    const { stored } = await this.load(from);
    const renamed = await this.saveStored({ ...stored, name: to }, false, undefined, false);
    await this.port.deleteModel(from);
    this.cache().delete(from);
    await this.recalculate();
    return renamed;
  }

  async delete(name: string): Promise<void> {
    await this.port.deleteModel(name);
    this.cache().delete(name);
    await this.recalculate();
  }

  /** Forgets the cached models (after the workbook changed behind our back). */
  refresh(): void {
    caches.delete(this.port);
  }

  private async saveStored(stored: StoredModel, replace: boolean, learner?: Learner, recalculate = true): Promise<LoadedModel> {
    const text = storedModelText(stored);
    const checked = check(stored.name, text); // the text exactly as it will be read back
    if (!replace && (await this.has(stored.name))) {
      throw new InputError(`a model named "${stored.name}" is already saved in this workbook; choose another name or replace it`);
    }
    await this.port.saveModel(stored.name, text);
    await prepareHolidays(stored.setup.region);
    const loaded: LoadedModel = { name: stored.name, stored: checked.stored, learner: learner ?? checked.learner };
    this.cache().set(stored.name, Promise.resolve(loaded));
    if (recalculate) await this.recalculate();
    return loaded;
  }

  /** LOOM cells follow the models: recalculate after every change (a failure here loses no model). */
  private async recalculate(): Promise<void> {
    try {
      await this.port.recalculate?.();
    } catch {
      // the model is saved; the host recalculates on its own schedule
    }
  }

  private cache(): Map<string, Promise<LoadedModel>> {
    let cache = caches.get(this.port);
    if (!cache) caches.set(this.port, (cache = new Map()));
    return cache;
  }
}

// the rule of the stored-model schema (src/engine/model-file/model-schema.ts), said plainly
const NAME = /^[A-Za-z0-9_][A-Za-z0-9_ .-]*$/;

function checkName(name: string): void {
  if (typeof name !== 'string' || name.length > 64 || !NAME.test(name) || ['__proto__', 'constructor', 'prototype'].includes(name)) {
    throw new InputError(`"${clip(String(name))}" cannot name a model: use up to 64 letters, digits, spaces, _ . or -, starting with a letter, digit or _ (e.g. week-ahead)`);
  }
}

function check(name: string, text: string): { stored: StoredModel; learner: Learner } {
  const source = `model "${clip(name)}"`;
  const stored = parseStoredModel(text, source);
  if (stored.name !== name) throw new InputError(`${source} is stored under another name than its own ("${clip(stored.name)}"); rename or delete it`);
  return { stored, learner: learnerFromStored(stored, source) };
}

function missing(name: string, names: string[]): string {
  const list = names.length ? `saved models: ${names.slice(0, 8).map((n) => `"${n}"`).join(', ')}${names.length > 8 ? ', …' : ''}` : 'no model is saved yet';
  return `no model named "${clip(name)}" is saved in this workbook (${list}); train and save one in the Spotloom pane`;
}

function clip(s: string): string {
  return s.length > 64 ? `${s.slice(0, 64)}…` : s;
}

// ---- the workbook the running add-in works on -------------------------------------------

let bound: ModelStore | undefined;
let waiting: ((store: ModelStore) => void)[] = [];

/**
 * Makes `port` the workbook that the cell functions and the pane use;
 * binding the same port again keeps the store (and its cache).
 */
export function bindWorkbook(port: WorkbookPort): ModelStore {
  if (bound?.port !== port) bound = new ModelStore(port);
  const store = bound;
  const ready = waiting;
  waiting = [];
  ready.forEach((resolve) => resolve(store));
  return store;
}

/** The store of the bound workbook, if one is bound (does not wait). */
export function currentModelStore(): ModelStore | undefined {
  return bound;
}

/** Forgets the bound workbook (tests, and a preview that loads another workbook). */
export function unbindWorkbook(): void {
  bound = undefined;
}

/**
 * The store of the bound workbook; waits for the binding (the host may call a
 * cell function before the add-in has finished starting).
 * @throws InputError when no workbook is bound within `timeoutMs`
 */
export function boundModelStore(timeoutMs = 15_000): Promise<ModelStore> {
  if (bound) return Promise.resolve(bound);
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      waiting = waiting.filter((w) => w !== done);
      reject(new InputError('the workbook is not ready for Spotloom yet; recalculate in a moment (or open the Spotloom pane)'));
    }, timeoutMs);
    const done = (store: ModelStore) => { clearTimeout(timer); resolve(store); };
    waiting.push(done);
  });
}
