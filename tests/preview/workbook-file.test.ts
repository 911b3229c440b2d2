import { describe, expect, it } from 'vitest';
import { addBlock, WorkbookFile, type KeyValueStorage, type WrittenBlock } from '../../src/preview/workbook-file';

function storage(items: Record<string, string> = {}): KeyValueStorage & { data: Map<string, string> } {
  const data = new Map(Object.entries(items));
  return { data, getItem: (k) => data.get(k) ?? null, setItem: (k, v) => void data.set(k, v), removeItem: (k) => void data.delete(k) };
}

const P = 'spotloom-preview/v1/';

describe('WorkbookFile', () => {
  it('writes each part under its own key and reads it back', () => {
    const s = storage();
    const file = new WorkbookFile(s);
    const block: WrittenBlock = { sheet: 'S', row: 1, column: 2, values: [[1, 'a', null, true]] };
    expect(file.write('models', { m: 'text' })).toBeUndefined();
    file.write('sheets', ['Added']);
    file.write('blocks', [block]);
    file.write('charts', [{ sheet: 'S', address: 'A1:B3', title: 't' }]);
    expect([...s.data.keys()].sort()).toEqual([`${P}blocks`, `${P}charts`, `${P}models`, `${P}sheets`]);
    expect(file.read()).toEqual({ models: { m: 'text' }, sheets: ['Added'], blocks: [block], charts: [{ sheet: 'S', address: 'A1:B3', title: 't' }] });
    file.clear();
    expect(s.data.size).toBe(0);
  });

  it('ignores whatever in the storage has the wrong shape, part by part', () => {
    const file = new WorkbookFile(storage({
      // JSON.parse makes "__proto__" an own key; it must neither name a model nor set a prototype
      [`${P}models`]: '{"ok":"text","bad":42,"__proto__":"x","constructor":{"polluted":true}}',
      [`${P}sheets`]: '{not json',
      [`${P}blocks`]: JSON.stringify([
        { sheet: 'S', row: 0, column: 0, values: [[1]] },
        { sheet: 'S', row: -1, column: 0, values: [[1]] },
        { sheet: 'S', row: 0, column: 0, values: [[1], [1, 2]] },
        { sheet: 'S', row: 0, column: 0, values: [[{ f: 1 }]] },
        { sheet: 'S', row: 0.5, column: 0, values: [[1]] },
      ]),
      [`${P}charts`]: JSON.stringify([{ sheet: 'S' }]),
    }));
    const read = file.read();
    expect(read.models).toEqual({ ok: 'text' });
    expect(Object.getPrototypeOf(read.models)).toBe(Object.prototype);
    expect(read.sheets).toEqual([]);
    expect(read.blocks).toEqual([{ sheet: 'S', row: 0, column: 0, values: [[1]] }]);
    expect(read.charts).toEqual([]);
  });

  it('says in one line why a part could not be kept, and that nothing is kept without storage', () => {
    const refusing: KeyValueStorage = { getItem: () => null, setItem: () => { throw Object.assign(new Error('full'), { name: 'QuotaExceededError' }); }, removeItem: () => undefined };
    expect(new WorkbookFile(refusing).write('blocks', [])).toMatch(/^the browser's storage refused the written cells \(QuotaExceededError\): they are lost on reload/);
    expect(new WorkbookFile(undefined).write('models', {})).toMatch(/gives the page no storage/);
    expect(new WorkbookFile(undefined).read()).toEqual({ models: {}, sheets: [], blocks: [], charts: [] });
  });
});

describe('addBlock(blocks, block)', () => {
  it('drops earlier blocks of the same sheet that the new one covers, keeps the rest in order', () => {
    const a: WrittenBlock = { sheet: 'S', row: 0, column: 0, values: [[1, 2]] };
    const b: WrittenBlock = { sheet: 'T', row: 0, column: 0, values: [[1]] };
    const c: WrittenBlock = { sheet: 'S', row: 5, column: 0, values: [[1]] };
    const cover: WrittenBlock = { sheet: 's', row: 0, column: 0, values: [[0, 0], [0, 0]] };
    expect(addBlock([a, b, c], cover)).toEqual([b, c, cover]);
    const partly: WrittenBlock = { sheet: 'S', row: 0, column: 1, values: [[9]] };
    expect(addBlock([a], partly)).toEqual([a, partly]);
  });
});
