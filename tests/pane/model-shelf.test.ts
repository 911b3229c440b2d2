import { beforeAll, describe, expect, it } from 'vitest';
import { parseStoredModel } from '../../src/engine';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { ModelStore } from '../../src/host/model-store';
import { checkModelName, modelFacts, renamedText, shelfOf } from '../../src/pane/logic/model-shelf';
import { trainedText } from './support';

let text = '';
beforeAll(async () => { text = await trainedText('main'); });

const asker = (answer: boolean) => {
  const questions: string[] = [];
  return { questions, ask: async (q: string) => { questions.push(q); return answer; } };
};

describe('checkModelName(name)', () => {
  it('accepts what the stored-model schema accepts and refuses the rest', () => {
    expect(checkModelName(' desk-1.b ')).toBe('desk-1.b');
    expect(() => checkModelName('a/b')).toThrow(/cannot name a model/);
    expect(() => checkModelName('__proto__')).toThrow(/cannot name a model/);
    expect(() => checkModelName('')).toThrow(/cannot name a model/);
  });
});

describe('renamedText(text, name)', () => {
  it('sets the inner name and keeps everything else', () => {
    const renamed = parseStoredModel(renamedText(text, 'other'));
    expect(renamed.name).toBe('other');
    expect({ ...renamed, name: 'main' }).toEqual(parseStoredModel(text));
  });
});

describe('shelfOf(store)', () => {
  it('saves a trained model so that the store (and the cell functions) can load it', async () => {
    const port = new MemoryWorkbook();
    const shelf = shelfOf(new ModelStore(port));
    const { ask, questions } = asker(true);
    expect(await shelf.save('main', text, ask)).toBe(true);
    expect(questions).toEqual([]);
    expect((await new ModelStore(port).load('main')).stored.name).toBe('main');
    expect((await shelf.list()).map((m) => m.name)).toEqual(['main']);
  });

  it('asks before replacing a model of the same name, and keeps the old one on no', async () => {
    const port = new MemoryWorkbook({ models: { main: renamedText(text, 'main') } });
    const before = (await port.loadModels()).main;
    const no = asker(false);
    expect(await shelfOf(new ModelStore(port)).save('main', renamedText(text, 'x'), no.ask)).toBe(false);
    expect(no.questions[0]).toMatch(/already saved in this workbook\. Replace it/);
    expect((await port.loadModels()).main).toBe(before);
  });

  it('renames after asking: the model is then under the new name only, with that inner name', async () => {
    const port = new MemoryWorkbook({ models: { main: text } });
    const shelf = shelfOf(new ModelStore(port));
    const no = asker(false);
    expect(await shelf.rename('main', 'spot', no.ask)).toBe(false);
    expect(Object.keys(await port.loadModels())).toEqual(['main']);
    expect(await shelf.rename('main', 'spot', asker(true).ask)).toBe(true);
    const models = await port.loadModels();
    expect(Object.keys(models)).toEqual(['spot']);
    expect(parseStoredModel(models.spot).name).toBe('spot');
  });

  it('refuses to rename onto a name that is taken', async () => {
    const port = new MemoryWorkbook({ models: { main: text, spot: renamedText(text, 'spot') } });
    await expect(shelfOf(new ModelStore(port)).rename('main', 'spot', asker(true).ask)).rejects.toThrow(/already/);
  });

  it('deletes only after a yes', async () => {
    const port = new MemoryWorkbook({ models: { main: text } });
    const shelf = shelfOf(new ModelStore(port));
    expect(await shelf.remove('main', asker(false).ask)).toBe(false);
    expect(Object.keys(await port.loadModels())).toEqual(['main']);
    expect(await shelf.remove('main', asker(true).ask)).toBe(true);
    expect(await port.loadModels()).toEqual({});
  });

  it('lists a model whose text fails the schema with its problem', async () => {
    const port = new MemoryWorkbook({ models: { broken: '{"format":"other"}' } });
    const [entry] = await shelfOf(new ModelStore(port)).list();
    expect(entry.stored).toBeUndefined();
    expect(entry.problem).toMatch(/not a valid Spotloom model/);
  });
});

describe('modelFacts(stored)', () => {
  it('gives trained range, resolution, validation MAE and creation time', () => {
    const stored = parseStoredModel(text);
    const facts = Object.fromEntries(modelFacts(stored).map((f) => [f.label, f.value]));
    expect(facts['trained on']).toBe(`${stored.trainedFrom} to ${stored.trainedTo}`);
    expect(facts.resolution).toBe('60 minutes (24 periods a day), Europe/Berlin');
    expect(facts['validation MAE']).toBe(`${stored.holdout.mae.toFixed(2)} over the last ${stored.holdout.days} days, which took part in no training choice (naive-week ${stored.holdout.maeNaiveWeek!.toFixed(2)})`);
    expect(facts.created).toBe(stored.createdAt);
  });
});
