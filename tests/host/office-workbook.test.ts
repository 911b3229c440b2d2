import { afterEach, describe, expect, it } from 'vitest';
import { storedModelText } from '../../src/engine';
import { MODEL_XML_NAMESPACE, modelXml } from '../../src/host/model-xml';
import { ModelStore } from '../../src/host/model-store';
import { OfficeWorkbook } from '../../src/host/office-workbook';
import { writeWithConsent } from '../../src/host/safe-write';
import { fixture } from '../functions/fixture';
import { fakeExcel, type FakeExcel } from './office-fake';

function connect(fake: FakeExcel): OfficeWorkbook {
  (globalThis as { Excel?: unknown }).Excel = fake.Excel;
  return new OfficeWorkbook();
}

afterEach(() => { delete (globalThis as { Excel?: unknown }).Excel; });

describe('OfficeWorkbook (office-addin-mock)', () => {
  it('readRange loads values and gives null for empty cells', async () => {
    const wb = connect(fakeExcel({ sheets: { History: [['timestamp', 'price'], [45658, '']] } }));
    expect(await wb.readRange('History!A1:B2')).toEqual([['timestamp', 'price'], [45658, null]]);
  });

  it('readFormulas gives formulas as written, and an address without sheet reads the active sheet', async () => {
    const wb = connect(fakeExcel({ sheets: { Out: [['=LOOM.AHEAD("m",A1:A9,B1:B9)', 3]] } }));
    expect(await wb.readFormulas('A1:B1')).toEqual([['=LOOM.AHEAD("m",A1:A9,B1:B9)', 3]]);
  });

  it('writeRange writes values and formulas, empties cells for null, and must fit its address', async () => {
    const fake = fakeExcel({ sheets: { Out: [['old', 'old']] } });
    const wb = connect(fake);
    await wb.writeRange('Out!A1:C1', [[1, null, '=A1*2']]);
    expect([...fake.sheets.get('Out')!.entries()]).toEqual([['0,0', 1], ['0,2', '=A1*2']]);
    await expect(wb.writeRange('Out!A1:B1', [[1]])).rejects.toThrow(/has 1 × 2 cells but 1 × 1 values/);
  });

  it('writeRange with number formats sets Range.numberFormat per cell, General where none is given', async () => {
    const fake = fakeExcel({ sheets: { Out: [] } });
    const wb = connect(fake);
    await wb.writeRange('Out!A1:B1', [[41.5, 0.9]], [['0.00', null]]);
    expect([fake.formats.get('Out!A1'), fake.formats.get('Out!B1')]).toEqual(['0.00', 'General']);
    await expect(wb.writeRange('Out!A1:B1', [[1, 2]], [['0.00']])).rejects.toThrow(/1 × 1 number formats/);
  });

  it('large ranges go to the host in blocks of rows', async () => {
    const fake = fakeExcel({ sheets: { Big: [] } });
    const wb = connect(fake);
    const rows = await wb.readRange('Big!A1:E40000');
    expect(rows).toHaveLength(40_000);
    expect(fake.requests.length).toBeGreaterThan(1);
    expect(Math.max(...fake.requests.map((r) => r.cells))).toBeLessThanOrEqual(100_000);
  });

  it('the one write path asks before overwriting through the Office adapter too', async () => {
    const fake = fakeExcel({ sheets: { Out: [['keep']] } });
    const wb = connect(fake);
    expect(await writeWithConsent(wb, async () => false, 'Out!A1', [[5]])).toBe(false);
    expect(fake.sheets.get('Out')!.get('0,0')).toBe('keep');
  });

  it('a missing sheet is the one error shape with what to check', async () => {
    const wb = connect(fakeExcel());
    await expect(wb.readRange('Nope!A1')).rejects.toThrow(/reading Nope!A1: the workbook has no such sheet or range/);
  });

  it('selectedAddress, listSheets and ensureSheet', async () => {
    const fake = fakeExcel({ sheets: { Sheet1: [], History: [] }, selection: 'History!B2:B5' });
    const wb = connect(fake);
    expect(await wb.selectedAddress()).toBe('History!B2:B5');
    await wb.ensureSheet('history');
    await wb.ensureSheet('Outlook');
    expect(await wb.listSheets()).toEqual(['Sheet1', 'History', 'Outlook']);
  });

  it('usedAddress reaches from A1 to the last used cell (the host\'s used range may start lower); an empty sheet has none', async () => {
    const wb = connect(fakeExcel({ sheets: { Out: [[null, null], [null, null, '=LOOM.SEQ(3)'], [null, 'x']], Empty: [] } }));
    expect(await wb.usedAddress('Out')).toBe('Out!A1:C3');
    expect(await wb.usedAddress('Empty')).toBeUndefined();
  });

  it('spillRanges asks the host where each formula spills; a formula that does not spill fills its own cell', async () => {
    const wb = connect(fakeExcel({ sheets: { Out: [['=LOOM.SEQ(3)', '=LOOM.MODEL("m")']] }, spills: { 'Out!A1': 'Out!A1:A3' } }));
    expect(await wb.spillRanges(['Out!A1', 'Out!B1'])).toEqual(['Out!A1:A3', 'Out!B1']);
    expect(await wb.spillRanges([])).toEqual([]);
  });

  it('dateSystem tells the 1904 system from DATE(1904,1,1)', async () => {
    expect(await connect(fakeExcel()).dateSystem()).toBe('1900');
    expect(await connect(fakeExcel({ dateSystem: '1904' })).dateSystem()).toBe('1904');
  });

  it('models live in custom XML parts of our namespace: save, replace, load, delete', async () => {
    const fake = fakeExcel({ parts: [{ id: 'other', xml: '<x xmlns="urn:someone-else">1</x>' }] });
    const wb = connect(fake);
    await wb.saveModel('a', '{"v":1}');
    await wb.saveModel('b', '{"v":"<2>"}');
    await wb.saveModel('a', '{"v":3}');
    expect(fake.parts.filter((p) => p.xml.includes(MODEL_XML_NAMESPACE))).toHaveLength(2);
    expect(await wb.loadModels()).toEqual({ a: '{"v":3}', b: '{"v":"<2>"}' });
    await wb.deleteModel('a');
    expect(await wb.loadModels()).toEqual({ b: '{"v":"<2>"}' });
    expect(fake.parts.map((p) => p.id)).toContain('other');
  });

  it('a stored model round-trips through the workbook and the model store', async () => {
    const fake = fakeExcel();
    const store = new ModelStore(connect(fake));
    await store.saveText(storedModelText(fixture().stored));
    store.refresh();
    expect((await store.load('test-linear')).stored).toEqual(fixture().stored);
  });

  it('a part that is ours but tampered with is listed with its problem, not loaded', async () => {
    const fake = fakeExcel({ parts: [{ id: 'p1', xml: modelXml('evil', '{"format":"spotloom-model","__proto__":{}}') }] });
    const store = new ModelStore(connect(fake));
    const [listed] = await store.list();
    expect(listed.name).toBe('evil');
    expect(listed.problem).toMatch(/not a valid Spotloom model/);
  });

  it('recalculate asks the host for a full recalculation, and the model store uses it after a save', async () => {
    const fake = fakeExcel();
    const wb = connect(fake);
    await wb.recalculate();
    expect(fake.calculations).toEqual(['Full']);
    await new ModelStore(wb).saveText(storedModelText(fixture().stored));
    expect(fake.calculations).toEqual(['Full', 'Full']);
  });

  it('addLineChart adds a line chart of the columns with a title', async () => {
    const fake = fakeExcel({ sheets: { Outlook: [] } });
    await connect(fake).addLineChart('Outlook', 'Outlook!A1:C26', 'Tomorrow');
    expect(fake.charts).toEqual([{ sheet: 'Outlook', type: 'Line', address: 'Outlook!A1:C26', seriesBy: 'Columns', title: 'Tomorrow', name: 'Spotloom Tomorrow' }]);
  });

  it('addLineChart replaces the chart of the same title instead of stacking another', async () => {
    const fake = fakeExcel({ sheets: { Outlook: [] } });
    const port = connect(fake);
    await port.addLineChart('Outlook', 'Outlook!A1:C26', 'Tomorrow');
    await port.addLineChart('Outlook', 'Outlook!A1:C30', 'Tomorrow');
    await port.addLineChart('Outlook', 'Outlook!E1:F26', 'Scores');
    expect(fake.charts.map((c) => [c.title, c.address])).toEqual([['Tomorrow', 'Outlook!A1:C30'], ['Scores', 'Outlook!E1:F26']]);
  });
});
