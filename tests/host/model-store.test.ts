import { afterEach, describe, expect, it } from 'vitest';
import { createModel, InputError, storedModelText, type Learner, type StoredModel } from '../../src/engine';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { bindWorkbook, boundModelStore, currentModelStore, ModelStore, unbindWorkbook } from '../../src/host/model-store';
import { fixture } from '../functions/fixture';

const text = (m: StoredModel) => storedModelText(m);

/** Hostile or broken stored models, each with what the store must say. */
function hostile(): [string, string, RegExp][] {
  const { stored } = fixture();
  const good = JSON.parse(text(stored));
  const weights: string = good.linear[0].weights;
  // weights are packed (model-file/packed-floats.ts): a NaN can only come in as a block's scale
  const raw = Uint8Array.from(atob(weights), (c) => c.charCodeAt(0));
  new DataView(raw.buffer).setFloat32(4, NaN, true);
  const nanWeights = btoa(String.fromCharCode(...raw));
  const withWeights = (w: string) => JSON.stringify({ ...good, linear: [{ ...good.linear[0], weights: w }, ...good.linear.slice(1)] });
  return [
    ['not json', '{"format":', /is not JSON/],
    // JSON.parse makes "__proto__" an own key; the strict schema refuses it and nothing is polluted
    ['prototype key', `{"__proto__":{"polluted":true},${text(stored).slice(1)}`, /not a valid Spotloom model/],
    ['extra key', JSON.stringify({ ...good, run: 'alert(1)' }), /not a valid Spotloom model/],
    ['wrong format', JSON.stringify({ ...good, format: 'other' }), /not a valid Spotloom model: format/],
    ['short weights', withWeights(weights.slice(0, 8)), /linear.0.weights is not a packed float array/],
    ['NaN weights', withWeights(nanWeights), /linear.0.weights is not a packed float array \(.*scale that is not a finite number\)/],
    ['huge', JSON.stringify({ ...good, notes: ['x'.repeat(2_200_000)] }), /larger than the 2 MB limit/],
    ['renamed inside', JSON.stringify({ ...good, name: 'other' }), /stored under another name/],
  ];
}

afterEach(() => unbindWorkbook());

describe('ModelStore', () => {
  it('saveText, list and load round-trip a model through the workbook', async () => {
    const wb = new MemoryWorkbook();
    const store = new ModelStore(wb);
    const { stored } = fixture();
    await store.saveText(text(stored));
    expect((await wb.loadModels())['test-linear']).toBe(text(stored));
    expect((await store.list()).map((m) => [m.name, m.stored?.trainedTo, m.problem])).toEqual([['test-linear', '2025-10-25', undefined]]);
    const loaded = await store.load('test-linear');
    expect(loaded.stored).toEqual(stored);
    expect(loaded.learner.state?.trainedTo).toBe('2025-10-25');
  });

  it('load caches per workbook: the pane and the functions share one learner', async () => {
    const wb = new MemoryWorkbook({ models: { 'test-linear': text(fixture().stored) } });
    const a = await new ModelStore(wb).load('test-linear');
    const b = await new ModelStore(wb).load('test-linear');
    expect(b.learner).toBe(a.learner);
    const other = await new ModelStore(new MemoryWorkbook({ models: { 'test-linear': text(fixture().stored) } })).load('test-linear');
    expect(other.learner).not.toBe(a.learner);
  });

  it('save(learner, meta) stores a trained learner and refuses to replace one silently', async () => {
    const { market } = fixture();
    const store = new ModelStore(new MemoryWorkbook());
    const learner = (await new ModelStore(new MemoryWorkbook({ models: { 'test-linear': text(fixture().stored) } })).load('test-linear')).learner;
    const saved = await store.save(learner, { name: 'desk', zone: market.zone, resolution: 60 });
    expect(saved.learner).toBe(learner);
    await expect(store.save(learner, { name: 'desk', zone: market.zone, resolution: 60 })).rejects.toThrow(/already saved/);
    await expect(store.save(learner, { name: 'desk', zone: market.zone, resolution: 60 }, true)).resolves.toMatchObject({ name: 'desk' });
    await expect(store.save(learner, { name: '../evil', zone: market.zone, resolution: 60 })).rejects.toThrow(/cannot name a model/);
    await expect(store.save(createModel('linear') as Learner, { name: 'untrained', zone: market.zone, resolution: 60 })).rejects.toThrow(/not been trained/);
  });

  it('rename moves a model to a new name (inside its text too) and delete removes it', async () => {
    const wb = new MemoryWorkbook({ models: { 'test-linear': text(fixture().stored), taken: text({ ...fixture().stored, name: 'taken' }) } });
    const store = new ModelStore(wb);
    await expect(store.rename('test-linear', 'taken')).rejects.toThrow(/"taken" is already saved/);
    await store.rename('test-linear', 'desk v2');
    const models = await wb.loadModels();
    expect(Object.keys(models).sort()).toEqual(['desk v2', 'taken']);
    expect(JSON.parse(models['desk v2']).name).toBe('desk v2');
    await expect(store.load('test-linear')).rejects.toThrow(/no model named "test-linear"/);
    await store.delete('desk v2');
    expect(await store.has('desk v2')).toBe(false);
    await expect(store.load('desk v2')).rejects.toThrow(InputError);
  });

  it('save, rename and delete make the workbook recalculate, so LOOM cells follow the models', async () => {
    const wb = new MemoryWorkbook();
    const store = new ModelStore(wb);
    await store.saveText(text(fixture().stored));
    await store.rename('test-linear', 'b');
    await store.delete('b');
    expect(wb.recalculations).toBe(3);
  });

  it('every hostile stored model is refused on load and listed with its problem', async () => {
    for (const [what, body, message] of hostile()) {
      const wb = new MemoryWorkbook({ models: { 'test-linear': body } });
      const store = new ModelStore(wb);
      await expect(store.load('test-linear'), what).rejects.toThrow(message);
      const [listed] = await store.list();
      expect(listed.stored, what).toBeUndefined();
      expect(listed.problem, what).toMatch(message);
      expect(({} as { polluted?: boolean }).polluted, what).toBeUndefined();
    }
  });

  it('a model file that fails the checks is never saved', async () => {
    const wb = new MemoryWorkbook();
    await expect(new ModelStore(wb).saveText(hostile()[5][1])).rejects.toThrow(/not a finite number/);
    expect(await wb.loadModels()).toEqual({});
  });

  it('load("") and load of a missing name say what to do', async () => {
    const store = new ModelStore(new MemoryWorkbook());
    await expect(store.load('')).rejects.toThrow(/give the name of a model/);
    await expect(store.load('x')).rejects.toThrow(/no model named "x" is saved in this workbook \(no model is saved yet\); train and save one in the Spotloom pane/);
  });
});

describe('bindWorkbook / boundModelStore', () => {
  it('boundModelStore waits for the workbook to be bound', async () => {
    const waiting = boundModelStore(1000);
    const wb = new MemoryWorkbook();
    const store = bindWorkbook(wb);
    expect(await waiting).toBe(store);
    expect(bindWorkbook(wb)).toBe(store);
    expect(currentModelStore()).toBe(store);
  });

  it('boundModelStore gives up with a clear message', async () => {
    await expect(boundModelStore(20)).rejects.toThrow(/not ready for Spotloom yet/);
  });
});
