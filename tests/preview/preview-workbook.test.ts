import { afterEach, describe, expect, it } from 'vitest';
import { storedModelText } from '../../src/engine';
import { bindWorkbook, ModelStore, unbindWorkbook } from '../../src/host/model-store';
import { writeWithConsent } from '../../src/host/safe-write';
import type { CellValue } from '../../src/host/workbook-port';
import type { LoomFunction } from '../../src/preview/loom-functions';
import { PreviewWorkbook, type PreviewEvent } from '../../src/preview/preview-workbook';
import { WorkbookFile, type KeyValueStorage } from '../../src/preview/workbook-file';
import { fixture } from '../functions/fixture';

class MapStorage implements KeyValueStorage {
  readonly data = new Map<string, string>();
  failing = false;
  getItem(k: string) { return this.data.get(k) ?? null; }
  setItem(k: string, v: string) {
    if (this.failing) throw Object.assign(new Error('quota'), { name: 'QuotaExceededError' });
    this.data.set(k, v);
  }
  removeItem(k: string) { this.data.delete(k); }
}

const SEQ: Record<string, LoomFunction> = {
  SEQ: { call: (async (n: number) => Array.from({ length: n }, (_, i) => [i + 1])) as never, params: ['scalar'], required: 1 },
};

afterEach(() => unbindWorkbook());

describe('PreviewWorkbook', () => {
  it('reads computed values and what formulas spill, as the host does; readFormulas keeps the formula text', async () => {
    const port = new PreviewWorkbook({ sheets: { S: [['=LOOM.SEQ(3)', '=A2']] }, functions: SEQ });
    expect(await port.readRange('S!A1:B3')).toEqual([[1, 2], [2, null], [3, null]]);
    expect(await port.readFormulas('S!A1:A3')).toEqual([['=LOOM.SEQ(3)'], [2], [3]]);
    expect(port.cell('S', 1, 0)).toMatchObject({ raw: null, value: 2, spilled: true });
    expect(port.extent('S')).toEqual({ rows: 3, columns: 2 });
  });

  it('counts spilled cells as taken: writeWithConsent asks before writing over them, and a no writes nothing', async () => {
    const port = new PreviewWorkbook({ sheets: { S: [['=LOOM.SEQ(3)']] }, functions: SEQ });
    await port.settled();
    const asked: string[] = [];
    const written = await writeWithConsent(port, async (q) => { asked.push(q); return false; }, 'S!A2', [['mine']]);
    expect(written).toBe(false);
    expect(asked).toEqual(['S!A2 already holds 1 non-empty cell. Overwrite it?']);
    expect(await port.readFormulas('S!A2')).toEqual([[2]]);
  });

  it('recalculates after a write, so a formula follows the cells it reads', async () => {
    const port = new PreviewWorkbook({ sheets: { S: [[1, '=A1']] } });
    expect(await port.readRange('S!B1')).toEqual([[1]]);
    const events: PreviewEvent[] = [];
    port.on((e) => events.push(e));
    await port.writeRange('S!A1', [[7]]);
    expect(await port.readRange('S!B1')).toEqual([[7]]);
    expect(events).toContain('calculating');
    expect(port.calculations).toBeGreaterThanOrEqual(2);
  });

  it('a model saved through the host\'s ModelStore recalculates the LOOM cells that read it', async () => {
    const { stored } = fixture();
    const port = new PreviewWorkbook({ sheets: { S: [[`=LOOM.MODEL("${stored.name}", "kind")`]] } });
    bindWorkbook(port);
    await port.settled();
    expect(port.cell('S', 0, 0).result?.error?.code).toBe('#VALUE!');
    await new ModelStore(port).saveText(storedModelText(stored));
    await port.settled();
    expect(await port.readRange('S!A1')).toEqual([[stored.settings.kind]]);
  });

  it('keeps written cells, added sheets, models and charts in its file, and opens them again', async () => {
    const storage = new MapStorage();
    const sheets = { S: [['seed', 'kept']] as CellValue[][] };
    const first = new PreviewWorkbook({ sheets, file: new WorkbookFile(storage) });
    await first.writeRange('S!A1', [['changed']]);
    await first.writeRange('S!A1', [['changed again']]);
    await first.ensureSheet('Added');
    await first.writeRange('Added!B2:C2', [[1, '=B2']]);
    await first.saveModel('m', 'text of m');
    await first.addLineChart('Added', 'Added!B2:C2', 'a chart');
    await first.addLineChart('Added', 'Added!B2:C2', 'a chart'); // drawn again by a refresh: kept once
    const again = new PreviewWorkbook({ sheets, file: new WorkbookFile(storage) });
    expect(again.sheetNames()).toEqual(['S', 'Added']);
    expect(await again.readRange('S!A1:B1')).toEqual([['changed again', 'kept']]);
    expect(await again.readRange('Added!B2:C2')).toEqual([[1, 1]]);
    expect(await again.loadModels()).toEqual({ m: 'text of m' });
    expect(again.charts('added')).toEqual([{ sheet: 'Added', address: 'B2:C2', title: 'a chart' }]);
    expect(JSON.parse(storage.getItem('spotloom-preview/v1/blocks')!)).toHaveLength(2); // the first write to S!A1 was covered
    again.forget();
    expect(await new PreviewWorkbook({ sheets, file: new WorkbookFile(storage) }).readRange('S!A1')).toEqual([['seed']]);
  });

  it('a model text edited by hand in the storage is listed with its problem and never loaded', async () => {
    const storage = new MapStorage();
    storage.setItem('spotloom-preview/v1/models', JSON.stringify({ main: '{"format":"spotloom-model","weights":"alert(1)"}' }));
    const port = new PreviewWorkbook({ sheets: { S: [[1]] }, file: new WorkbookFile(storage) });
    const [entry] = await new ModelStore(port).list();
    expect(entry.name).toBe('main');
    expect(entry.stored).toBeUndefined();
    expect(entry.problem).toMatch(/not a valid Spotloom model/);
  });

  it('when the storage refuses a save it says so once, and the workbook itself still changes', async () => {
    const storage = new MapStorage();
    const port = new PreviewWorkbook({ sheets: { S: [[1]] }, file: new WorkbookFile(storage) });
    const events: PreviewEvent[] = [];
    port.on((e) => events.push(e));
    storage.failing = true;
    await port.writeRange('S!A1', [[2]]);
    await port.writeRange('S!A1', [[3]]);
    expect(port.storageProblem).toMatch(/storage refused the written cells \(QuotaExceededError\)/);
    expect(events.filter((e) => e === 'storage')).toHaveLength(1);
    expect(await port.readRange('S!A1')).toEqual([[3]]);
  });

  it('refuses what the in-memory workbook refuses: a write that does not fit its address, an unknown sheet', async () => {
    const port = new PreviewWorkbook({ sheets: { S: [[1]] } });
    await expect(port.writeRange('S!A1:B1', [[1]])).rejects.toThrow(/has 1 × 2 cells but 1 × 1 values/);
    await expect(port.writeRange('Nope!A1', [[1]])).rejects.toThrow(/no sheet named "Nope"/);
    await expect(port.ensureSheet('a/b')).rejects.toThrow(/cannot name a sheet/);
  });
});
