import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';

describe('MemoryWorkbook', () => {
  it('readRange gives the grid with null for empty cells, sheets matched without regard to case', async () => {
    const wb = new MemoryWorkbook({ sheets: { History: [['timestamp', 'price'], [45658, 41.2]] } });
    expect(await wb.readRange('history!A1:C2')).toEqual([['timestamp', 'price', null], [45658, 41.2, null]]);
  });

  it('an address without a sheet means the active sheet, which selecting changes', async () => {
    const wb = new MemoryWorkbook({ sheets: { A: [[1]], B: [[2]] } });
    expect(await wb.readRange('A1')).toEqual([[1]]);
    wb.select('B!A1:A2');
    expect(await wb.selectedAddress()).toBe('B!A1:A2');
    expect(await wb.readRange('A1')).toEqual([[2]]);
  });

  it('formula cells read through the evaluator, and as written through readFormulas', async () => {
    const wb = new MemoryWorkbook({ sheets: { S: [['=1+1', 3]] }, evaluate: (f) => (f === '=1+1' ? 2 : null) });
    expect(await wb.readRange('S!A1:B1')).toEqual([[2, 3]]);
    expect(await wb.readFormulas('S!A1:B1')).toEqual([['=1+1', 3]]);
    expect(await new MemoryWorkbook({ sheets: { S: [['=1+1']] } }).readRange('S!A1')).toEqual([[null]]);
  });

  it('number formats: written with the values, kept by a later write without formats (as the host keeps them), General as null', async () => {
    const wb = new MemoryWorkbook({ sheets: { S: [] } });
    await wb.writeRange('S!A1:B1', [[41.5, 0.9]], [['0.00', '0.0%']]);
    await wb.writeRange('S!A1', [[42]]);
    expect(await wb.readFormats('S!A1:C1')).toEqual([['0.00', '0.0%', null]]);
    await wb.writeRange('S!B1', [[0.8]], [['General']]);
    expect(await wb.readFormats('S!B1')).toEqual([[null]]);
  });

  it('writeRange must fit its address; null and empty text empty a cell', async () => {
    const wb = new MemoryWorkbook({ sheets: { S: [[1, 2]] } });
    await expect(wb.writeRange('S!A1:B1', [[1]])).rejects.toThrow(/has 1 × 2 cells but 1 × 1 values/);
    await wb.writeRange('S!A1:B1', [[null, '']]);
    expect(await wb.readRange('S!A1:B1')).toEqual([[null, null]]);
    expect(wb.usedGrid('S')).toEqual([]);
  });

  it('ensureSheet adds a missing sheet and never clears an existing one', async () => {
    const wb = new MemoryWorkbook({ sheets: { Outlook: [[1]] } });
    await wb.ensureSheet('outlook');
    await wb.ensureSheet('Archive');
    expect(await wb.listSheets()).toEqual(['Outlook', 'Archive']);
    expect(await wb.readRange('Outlook!A1')).toEqual([[1]]);
    await expect(wb.ensureSheet('a/b')).rejects.toThrow(/cannot name a sheet/);
    await expect(wb.readRange('Nope!A1')).rejects.toThrow(/no sheet named "Nope"/);
  });

  it('keeps models by name and records charts', async () => {
    const wb = new MemoryWorkbook({ models: { a: '{}' } });
    await wb.saveModel('b', 'text');
    await wb.deleteModel('a');
    expect(await wb.loadModels()).toEqual({ b: 'text' });
    await wb.addLineChart('Sheet1', 'Sheet1!A1:C25', 'Tomorrow');
    expect(wb.charts).toEqual([{ sheet: 'Sheet1', address: 'A1:C25', title: 'Tomorrow' }]);
    await wb.addLineChart('Sheet1', 'Sheet1!A1:C26', 'Tomorrow'); // a refresh replaces, never stacks
    expect(wb.charts).toEqual([{ sheet: 'Sheet1', address: 'A1:C26', title: 'Tomorrow' }]);
  });

  it('a model named __proto__ is an ordinary key, not the prototype', async () => {
    const wb = new MemoryWorkbook();
    await wb.saveModel('__proto__', 'x');
    const models = await wb.loadModels();
    expect(Object.keys(models)).toEqual(['__proto__']);
    expect(Object.getPrototypeOf(models)).toBe(Object.prototype);
  });

  it('usedGrid gives the used part of a sheet from A1', async () => {
    const wb = new MemoryWorkbook({ sheets: { S: [] } });
    await wb.writeRange('S!B2', [['x']]);
    expect(wb.usedGrid('S')).toEqual([[null, null], [null, 'x']]);
  });

  it('dateSystem is the one it was made with', async () => {
    expect(await new MemoryWorkbook().dateSystem()).toBe('1900');
    expect(await new MemoryWorkbook({ dateSystem: '1904' }).dateSystem()).toBe('1904');
  });
});
