import { InputError, parseStoredModel, storedModelText, StoredModelSchema, type StoredModel } from '../../engine';
import type { ModelStore } from '../../host/model-store';
import type { AskUser } from '../../host/workbook-port';

/**
 * The models saved in this workbook, as the Models section lists them.
 * Every text read back goes through the stored-model schema (the host's
 * ModelStore does it); one that does not pass is listed with its problem
 * instead of being used.
 */
export interface ShelfEntry {
  name: string;
  stored?: StoredModel;
  problem?: string;
}

/** What the pane needs from model storage; shelfOf(ModelStore) in the add-in and the preview. */
export interface ModelShelf {
  list(): Promise<ShelfEntry[]>;
  /** validated text of a trained model; asks before replacing one of the same name */
  save(name: string, text: string, ask: AskUser): Promise<boolean>;
  rename(from: string, to: string, ask: AskUser): Promise<boolean>;
  remove(name: string, ask: AskUser): Promise<boolean>;
}

/**
 * Checks a model name with the schema's own rule (letters, digits, `_ . -`
 * and spaces, 1–64 characters).
 *
 * @throws InputError with the rule when the name is not allowed
 */
export function checkModelName(name: string): string {
  const checked = StoredModelSchema.shape.name.safeParse(name.trim());
  if (!checked.success) {
    throw new InputError(`"${name}" cannot name a model: use 1 to 64 letters, digits, spaces and _ . - (not starting with a space)`);
  }
  return checked.data;
}

/**
 * The stored text of `text` under `name`: parsed through the schema, with
 * its inner name set to `name`, written back through storedModelText (which
 * checks the size limit).
 */
export function renamedText(text: string, name: string): string {
  const stored = parseStoredModel(text);
  return storedModelText({ ...stored, name: checkModelName(name) });
}

/**
 * The pane's shelf over the host's ModelStore, so that a model saved,
 * renamed or deleted here is at once what the cell functions see (the
 * store's cache is shared per workbook). Every change is confirmed first.
 */
export function shelfOf(store: ModelStore): ModelShelf {
  return {
    list: () => store.list(),
    async save(name, text, ask) {
      const clean = checkModelName(name);
      const final = renamedText(text, clean);
      if ((await store.has(clean)) && !(await ask(`A model named "${clean}" is already saved in this workbook. Replace it with the one just trained?`))) return false;
      await store.saveText(final, true);
      return true;
    },
    async rename(from, to, ask) {
      const clean = checkModelName(to);
      if (clean === from) return false;
      if (!(await store.has(from))) throw new InputError(`there is no model named "${from}" in this workbook`);
      if (await store.has(clean)) throw new InputError(`a model named "${clean}" already exists; pick another name or delete that one first`);
      if (!(await ask(`Rename model "${from}" to "${clean}"? Cells that call LOOM functions with "${from}" need the new name.`))) return false;
      await store.rename(from, clean); // saves under the new name first, then deletes the old one
      return true;
    },
    async remove(name, ask) {
      if (!(await ask(`Delete model "${name}" from this workbook? Cells that use it will show an error until a model of that name is saved again.`))) return false;
      await store.delete(name);
      return true;
    },
  };
}

/** Facts about a stored model for the Models list and the outlook. */
export function modelFacts(stored: StoredModel): { label: string; value: string }[] {
  const v = stored.holdout;
  const fmt = (x: number | null) => (x === null || !Number.isFinite(x) ? 'n/a' : x.toFixed(2));
  return [
    { label: 'kind', value: stored.settings.kind },
    { label: 'trained on', value: `${stored.trainedFrom} to ${stored.trainedTo}` },
    { label: 'resolution', value: `${stored.resolution} minutes (${stored.setup.slots} periods a day), ${stored.zone}` },
    { label: 'validation MAE', value: `${fmt(v.mae)} over the last ${v.days} ${v.days === 1 ? 'day' : 'days'}, which took part in no training choice (naive-week ${fmt(v.maeNaiveWeek)})` },
    { label: 'drivers', value: stored.setup.drivers.length ? stored.setup.drivers.join(', ') : 'none' },
    { label: 'created', value: stored.createdAt },
  ];
}
