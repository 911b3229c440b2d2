import { beforeAll, describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { ModelStore } from '../../src/host/model-store';
import { trainAndSave } from '../../src/pane/jobs/train-and-save';
import { shelfOf } from '../../src/pane/logic/model-shelf';
import { trainedText } from './support';

let text = '';
beforeAll(async () => { text = await trainedText('main'); });

describe('trainAndSave(result, shelf, name, replaceConfirmed)', () => {
  it('a cancelled training leaves the workbook without any model', async () => {
    const port = new MemoryWorkbook();
    const out = await trainAndSave(Promise.resolve({ type: 'cancelled' }), shelfOf(new ModelStore(port)), 'main', false);
    expect(out).toEqual({ status: 'cancelled' });
    expect(await port.loadModels()).toEqual({});
  });

  it('a failed training saves nothing and passes its message on', async () => {
    const port = new MemoryWorkbook();
    const out = await trainAndSave(Promise.resolve({ type: 'failed', message: 'too short' }), shelfOf(new ModelStore(port)), 'main', false);
    expect(out).toEqual({ status: 'failed', message: 'too short' });
    expect(await port.loadModels()).toEqual({});
  });

  it('a finished training is saved under the chosen name, after the schema check', async () => {
    const port = new MemoryWorkbook();
    const out = await trainAndSave(Promise.resolve({ type: 'trained', text, seconds: 2 }), shelfOf(new ModelStore(port)), 'desk', false);
    expect(out.status).toBe('saved');
    expect(Object.keys(await port.loadModels())).toEqual(['desk']);
    expect((await new ModelStore(port).load('desk')).stored.name).toBe('desk');
  });

  it('a text that fails the schema is refused and not saved', async () => {
    const port = new MemoryWorkbook();
    await expect(trainAndSave(Promise.resolve({ type: 'trained', text: '{"format":"x"}', seconds: 1 }), shelfOf(new ModelStore(port)), 'main', false))
      .rejects.toThrow(/not a valid Spotloom model/);
    expect(await port.loadModels()).toEqual({});
  });

  it('keeps an existing model of that name unless replacing was confirmed', async () => {
    const port = new MemoryWorkbook({ models: { main: text } });
    const before = (await port.loadModels()).main;
    const out = await trainAndSave(Promise.resolve({ type: 'trained', text: text.replace('"seed":1', '"seed":2'), seconds: 1 }), shelfOf(new ModelStore(port)), 'main', false);
    expect(out).toEqual({ status: 'not saved' });
    expect((await port.loadModels()).main).toBe(before);
  });
});
