import { InputError } from '../engine';
import { formatA1, parseA1 } from './a1';
import { logHostError } from './host-detect';
import { MODEL_XML_NAMESPACE, modelXml, readModelXml } from './model-xml';
import type { CellValue, NumberFormat, WorkbookPort } from './workbook-port';

/**
 * The WorkbookPort over the host's Excel JavaScript API (Office.js).
 *
 * Where models are stored: one custom XML part per model in our own
 * namespace (model-xml.ts), not the document settings. The settings bag is
 * one JSON object that the host loads whole whenever the add-in starts and
 * rewrites whole on every save, and its documentation points to custom XML
 * parts for information "that exceeds the size limits of the document
 * Settings or which has a structured character". A model is up to 2 MB of
 * text (typically 40–300 KB), so each gets its own part, read only when a
 * model is asked for and written alone. A single request to the web host is
 * limited to 5 MB (resource limits of Office Add-ins), which the 2 MB cap
 * on a model keeps us below. Requires ExcelApi 1.5.
 *
 * Large ranges are read and written in blocks of rows so that no single
 * request grows beyond that limit either.
 */
const CELLS_PER_REQUEST = 100_000;

type Run = <T>(batch: (context: Excel.RequestContext) => Promise<T>) => Promise<T>;

export class OfficeWorkbook implements WorkbookPort {
  readonly kind = 'office';
  private readonly run: Run;

  /** @param run Excel.run, or a stand-in for tests */
  constructor(run?: Run) {
    this.run = run ?? ((batch) => Excel.run(batch));
  }

  async dateSystem(): Promise<'1900' | '1904'> {
    // DATE(1904,1,1) is serial 1462 in the 1900 date system and 0 in the 1904 one
    return this.call('reading the date system', async (context) => {
      const result = context.workbook.functions.date(1904, 1, 1);
      result.load('value');
      await context.sync();
      return result.value === 0 ? '1904' : '1900';
    });
  }

  async selectedAddress(): Promise<string> {
    return this.call('reading the selection', async (context) => {
      const range = context.workbook.getSelectedRange();
      range.load('address');
      await context.sync();
      return range.address;
    });
  }

  async readRange(address: string): Promise<CellValue[][]> {
    return this.readProperty(address, 'values');
  }

  async readFormulas(address: string): Promise<CellValue[][]> {
    return this.readProperty(address, 'formulas');
  }

  async writeRange(address: string, values: CellValue[][], formats?: NumberFormat[][]): Promise<void> {
    const r = parseA1(address);
    if (values.length !== r.rows || values.some((row) => row.length !== r.columns)) {
      throw new InputError(`${address} has ${r.rows} × ${r.columns} cells but ${values.length} × ${values[0]?.length ?? 0} values were given`);
    }
    if (formats && (formats.length !== r.rows || formats.some((row) => row.length !== r.columns))) {
      throw new InputError(`${address} has ${r.rows} × ${r.columns} cells but ${formats.length} × ${formats[0]?.length ?? 0} number formats were given`);
    }
    await this.call(`writing ${address}`, async (context) => {
      for (const block of blocks(r.rows, r.columns)) {
        const range = this.range(context, formatA1({ ...r, row: r.row + block.from, rows: block.rows }));
        // `formulas` takes constants and formulas alike; '' empties a cell (null would leave it unchanged)
        range.formulas = values.slice(block.from, block.from + block.rows).map((row) => row.map((v) => (v === null ? '' : v))) as never;
        // Range.numberFormat takes one format code per cell; "General" is the host's default
        if (formats) range.numberFormat = formats.slice(block.from, block.from + block.rows).map((row) => row.map((f) => f ?? 'General'));
        await context.sync();
      }
    });
  }

  async listSheets(): Promise<string[]> {
    return this.call('listing the sheets', async (context) => {
      const sheets = context.workbook.worksheets;
      sheets.load('items/name');
      await context.sync();
      return sheets.items.map((s) => s.name);
    });
  }

  async usedAddress(sheet: string): Promise<string | undefined> {
    return this.call(`reading the used range of "${sheet}"`, async (context) => {
      // valuesOnly false: cells that hold only a format are left out by the host anyway, formulas count (ExcelApi 1.4, from memory)
      const used = context.workbook.worksheets.getItem(sheet).getUsedRangeOrNullObject(false);
      used.load(['isNullObject', 'address']);
      await context.sync();
      if (used.isNullObject) return undefined;
      // the used range may start below A1; the port's promise is "from A1", which keeps row numbers plain
      const r = parseA1(used.address);
      return formatA1({ sheet: r.sheet ?? sheet, row: 0, column: 0, rows: r.row + r.rows, columns: r.column + r.columns });
    });
  }

  async spillRanges(cells: string[]): Promise<string[]> {
    if (cells.length === 0) return [];
    return this.call('reading where formulas spill', async (context) => {
      // getSpillingToRangeOrNullObject (ExcelApi 1.12, from memory): the whole range a dynamic-array formula fills
      const spills = cells.map((address) => {
        const spill = this.range(context, address).getSpillingToRangeOrNullObject();
        spill.load(['isNullObject', 'address']);
        return spill;
      });
      await context.sync();
      return spills.map((s, i) => (s.isNullObject ? cells[i] : s.address));
    });
  }

  async ensureSheet(name: string): Promise<void> {
    await this.call(`adding sheet "${name}"`, async (context) => {
      const sheet = context.workbook.worksheets.getItemOrNullObject(name);
      sheet.load('isNullObject');
      await context.sync();
      if (sheet.isNullObject) {
        context.workbook.worksheets.add(name);
        await context.sync();
      }
    });
  }

  async loadModels(): Promise<Record<string, string>> {
    return this.call('reading the saved models', async (context) => {
      const parts = await this.modelParts(context);
      const out = new Map<string, string>();
      for (const p of parts) if (p.model && !out.has(p.model.name)) out.set(p.model.name, p.model.text);
      return Object.fromEntries(out);
    });
  }

  async saveModel(name: string, text: string): Promise<void> {
    const xml = modelXml(name, text);
    await this.call(`saving model "${name}"`, async (context) => {
      const same = (await this.modelParts(context)).filter((p) => p.model?.name === name);
      if (same.length === 0) context.workbook.customXmlParts.add(xml);
      else {
        same[0].part.setXml(xml);
        for (const extra of same.slice(1)) extra.part.delete();
      }
      await context.sync();
    });
  }

  async deleteModel(name: string): Promise<void> {
    await this.call(`deleting model "${name}"`, async (context) => {
      const same = (await this.modelParts(context)).filter((p) => p.model?.name === name);
      for (const p of same) p.part.delete();
      await context.sync();
    });
  }

  async addLineChart(sheet: string, address: string, title: string): Promise<void> {
    await this.call(`adding a chart on "${sheet}"`, async (context) => {
      const ws = context.workbook.worksheets.getItem(sheet);
      // one chart per title: a refreshed outlook replaces its chart instead of stacking another
      const name = `Spotloom ${title}`.slice(0, 250);
      const old = ws.charts.getItemOrNullObject(name);
      old.load('isNullObject');
      await context.sync();
      if (!old.isNullObject) old.delete();
      const chart = ws.charts.add('Line', ws.getRange(stripSheet(address)), 'Columns');
      chart.name = name;
      chart.title.text = title;
      await context.sync();
    });
  }

  async recalculate(): Promise<void> {
    await this.call('recalculating the workbook', async (context) => {
      context.workbook.application.calculate('Full');
      await context.sync();
    });
  }

  private async readProperty(address: string, property: 'values' | 'formulas'): Promise<CellValue[][]> {
    const r = parseA1(address);
    return this.call(`reading ${address}`, async (context) => {
      const out: CellValue[][] = [];
      for (const block of blocks(r.rows, r.columns)) {
        const range = this.range(context, formatA1({ ...r, row: r.row + block.from, rows: block.rows }));
        range.load(property);
        await context.sync();
        for (const row of range[property] as unknown[][]) out.push(row.map(cellValue));
      }
      return out;
    });
  }

  private range(context: Excel.RequestContext, address: string): Excel.Range {
    const r = parseA1(address);
    const cells = stripSheet(address);
    const sheet = r.sheet === undefined ? context.workbook.worksheets.getActiveWorksheet() : context.workbook.worksheets.getItem(r.sheet);
    return sheet.getRange(cells);
  }

  private async modelParts(context: Excel.RequestContext): Promise<{ part: Excel.CustomXmlPart; model?: { name: string; text: string } }[]> {
    const parts = context.workbook.customXmlParts.getByNamespace(MODEL_XML_NAMESPACE);
    parts.load('items/id');
    await context.sync();
    const xml = parts.items.map((part) => ({ part, xml: part.getXml() }));
    await context.sync();
    return xml.map(({ part, xml }) => ({ part, model: readModelXml(xml.value) }));
  }

  /** Runs a batch; the host's "not found" and "bad argument" become the one error shape. */
  private async call<T>(what: string, batch: (context: Excel.RequestContext) => Promise<T>): Promise<T> {
    try {
      return await this.run(batch);
    } catch (err) {
      if (err instanceof InputError) throw err;
      const code = (err as { code?: string }).code;
      if (code === 'ItemNotFound') throw new InputError(`${what}: the workbook has no such sheet or range; check the name`);
      if (code === 'InvalidArgument' || code === 'InvalidReference') throw new InputError(`${what}: the host refused the address or value (${code})`);
      logHostError(err);
      throw new Error(`${what} failed in the spreadsheet host${code ? ` (${code})` : ''}: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
}

function stripSheet(address: string): string {
  const r = parseA1(address);
  return formatA1({ ...r, sheet: undefined });
}

function blocks(rows: number, columns: number): { from: number; rows: number }[] {
  const per = Math.max(1, Math.floor(CELLS_PER_REQUEST / Math.max(1, columns)));
  const out: { from: number; rows: number }[] = [];
  for (let from = 0; from < rows; from += per) out.push({ from, rows: Math.min(per, rows - from) });
  return out;
}

/** The host gives '' for an empty cell; the port says null. */
function cellValue(v: unknown): CellValue {
  if (v === '' || v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  return String(v);
}
