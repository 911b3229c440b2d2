import { formatA1, parseA1, type A1Range } from '../host/a1';
import { MemoryWorkbook, type RecordedChart } from '../host/memory-workbook';
import type { CellValue, NumberFormat, WorkbookPort } from '../host/workbook-port';
import { calculate, type Calculation, type CellSource, type FormulaCell, type FormulaResult, type ResultCache } from './formula-eval';
import { LOOM_FUNCTIONS, type LoomFunction } from './loom-functions';
import { addBlock, type SavedWorkbook, type WorkbookFile, type WrittenBlock } from './workbook-file';

/**
 * The preview's workbook port: the host's in-memory MemoryWorkbook holds
 * the cells and the models; this port adds what a spreadsheet application
 * would add around it, and nothing the pane could tell apart from a host:
 *
 * - formula cells are computed by the preview's evaluator (formula-eval.ts)
 *   after every write and every model change (`recalculate`, which the
 *   host's ModelStore calls), one recalculation at a time;
 * - reading a range gives computed values, including the cells a formula
 *   spills into (as the host does), once the running recalculation is done;
 * - every change is written to the workbook file (workbook-file.ts), so a
 *   reload of the page opens the same workbook with the same models.
 *
 * Listeners hear 'cells' (a write or a finished recalculation), 'calculating',
 * 'sheets', 'selection', 'models', 'charts' and 'storage' (a save failed).
 *
 * @example const port = new PreviewWorkbook({ sheets: demo.sheets, file }); await port.settled();
 */
export type PreviewEvent = 'cells' | 'calculating' | 'sheets' | 'selection' | 'models' | 'charts' | 'storage';

export interface PreviewWorkbookOptions {
  /** the workbook as it opens the first time, each sheet from A1 */
  sheets: Record<string, CellValue[][]>;
  /** where changes are kept across reloads (none: nothing is kept) */
  file?: WorkbookFile;
  selection?: string;
  functions?: Record<string, LoomFunction>;
}

/** What the grid shows in one cell. */
export interface CellView {
  /** as written: a value or a formula text */
  raw: CellValue;
  /** the computed value (for a formula, its result; for a spilled cell, the spilled value) */
  value: CellValue;
  result?: FormulaResult;
  spilled: boolean;
  /** the cell's number format (null: General) */
  format: NumberFormat;
}

const EMPTY: Calculation = { result: () => undefined, spilled: () => undefined, touches: () => false, results: () => [] };

export class PreviewWorkbook implements WorkbookPort {
  readonly kind = 'memory';
  readonly book: MemoryWorkbook;
  /** the last problem saving the workbook file, if any */
  storageProblem?: string;
  /** how many recalculations have finished */
  calculations = 0;
  private readonly file?: WorkbookFile;
  private readonly functions: Record<string, LoomFunction>;
  private readonly names: string[] = [];
  private readonly initial = new Set<string>();
  private readonly formulaCells = new Map<string, Map<string, FormulaCell>>();
  private readonly grids = new Map<string, CellValue[][]>();
  private readonly formatCache = new Map<string, Map<string, string>>();
  private readonly listeners = new Set<(event: PreviewEvent) => void>();
  private blocks: WrittenBlock[] = [];
  private calc: Calculation = EMPTY;
  private running?: Promise<void>;
  private dirty = false;
  private readonly versions = new Map<string, number>();
  private readonly cache: ResultCache = new Map();
  private modelsVersion = 0;
  private selection: A1Range;

  constructor(options: PreviewWorkbookOptions) {
    this.file = options.file;
    this.functions = options.functions ?? LOOM_FUNCTIONS;
    const saved: SavedWorkbook = options.file?.read() ?? { models: {}, sheets: [], blocks: [], charts: [] };
    this.book = new MemoryWorkbook({
      sheets: options.sheets,
      models: saved.models,
      selection: options.selection,
      evaluate: (_formula, at) => this.valueAt(at.sheet, at.row, at.column),
      spill: (at) => this.calc.result(at.sheet, at.row, at.column)?.spill,
    });
    for (const [name, grid] of Object.entries(options.sheets)) {
      this.names.push(name);
      this.initial.add(name.toLowerCase());
      grid.forEach((row, r) => row.forEach((v, c) => this.track(name, r, c, v)));
    }
    const first = parseA1(options.selection ?? formatA1({ sheet: this.names[0] ?? 'Sheet1', row: 0, column: 0, rows: 1, columns: 1 }));
    this.selection = { ...first, sheet: this.sheetName(first.sheet) ?? this.names[0] };
    for (const name of saved.sheets) this.addSheetName(name);
    for (const block of saved.blocks) this.applyBlock(block);
    for (const chart of saved.charts) {
      if (this.sheetName(chart.sheet)) this.book.charts.push({ ...chart, sheet: this.sheetName(chart.sheet)! });
    }
    this.schedule();
  }

  on(listener: (event: PreviewEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  // ---- the port ---------------------------------------------------------------------------

  dateSystem(): Promise<'1900' | '1904'> {
    return this.book.dateSystem();
  }

  selectedAddress(): Promise<string> {
    return this.book.selectedAddress();
  }

  /** Selects a range and activates its sheet, as a click in the grid does. */
  select(address: string): void {
    this.book.select(address);
    const r = parseA1(address);
    this.selection = { ...r, sheet: this.sheetName(r.sheet) ?? this.activeSheet() };
    this.emit('selection');
  }

  async readRange(address: string): Promise<CellValue[][]> {
    return this.read(address, true);
  }

  async readFormulas(address: string): Promise<CellValue[][]> {
    return this.read(address, false);
  }

  async writeRange(address: string, values: CellValue[][], formats?: NumberFormat[][]): Promise<void> {
    const r = parseA1(address);
    const sheet = this.sheetName(r.sheet ?? this.activeSheet()) ?? r.sheet ?? '';
    await this.book.writeRange(address, values, formats); // checks the address, the sheet and the size
    this.applyTracking(sheet, r.row, r.column, values);
    this.formatCache.delete(sheet.toLowerCase());
    this.blocks = addBlock(this.blocks, { sheet, row: r.row, column: r.column, values: values.map((row) => row.map((v) => (v === '' ? null : v))), ...(formats ? { formats } : {}) });
    this.save('blocks', this.blocks);
    this.emit('cells');
    this.schedule();
  }

  async listSheets(): Promise<string[]> {
    return this.book.listSheets();
  }

  async usedAddress(sheet: string): Promise<string | undefined> {
    await this.settled(); // what formulas spill is known once the recalculation is done
    return this.book.usedAddress(sheet);
  }

  async spillRanges(cells: string[]): Promise<string[]> {
    await this.settled();
    return this.book.spillRanges(cells);
  }

  async ensureSheet(name: string): Promise<void> {
    if (this.sheetName(name)) return;
    await this.book.ensureSheet(name);
    this.names.push(name);
    this.versions.set(name.toLowerCase(), (this.versions.get(name.toLowerCase()) ?? 0) + 1);
    this.save('sheets', this.addedSheets());
    this.emit('sheets');
  }

  loadModels(): Promise<Record<string, string>> {
    return this.book.loadModels();
  }

  async saveModel(name: string, text: string): Promise<void> {
    await this.book.saveModel(name, text);
    this.modelsVersion++;
    this.save('models', await this.book.loadModels());
    this.emit('models');
  }

  async deleteModel(name: string): Promise<void> {
    await this.book.deleteModel(name);
    this.modelsVersion++;
    this.save('models', await this.book.loadModels());
    this.emit('models');
  }

  async addLineChart(sheet: string, address: string, title: string): Promise<void> {
    await this.book.addLineChart(sheet, address, title);
    // a refresh draws its chart again: keep the newest one per sheet and title
    const latest = this.book.charts[this.book.charts.length - 1];
    const keep = this.book.charts.filter((c) => c === latest || c.sheet !== latest.sheet || c.title !== latest.title);
    this.book.charts.splice(0, this.book.charts.length, ...keep);
    this.save('charts', this.book.charts);
    this.emit('charts');
  }

  /** Starts a recalculation and returns at once (the host's recalculation runs on its own, too). */
  async recalculate(): Promise<void> {
    this.schedule();
  }

  // ---- for the grid view ----------------------------------------------------------------

  /** Resolves when no recalculation is running or waiting. */
  async settled(): Promise<void> {
    while (this.running) await this.running;
  }

  get calculating(): boolean {
    return this.running !== undefined;
  }

  sheetNames(): string[] {
    return [...this.names];
  }

  activeSheet(): string {
    return this.selection.sheet ?? this.names[0];
  }

  /** The selection as a range, with its sheet. */
  selectionNow(): A1Range {
    return this.selection;
  }

  /** rows × columns of the used part of a sheet (formulas and values as written). */
  grid(sheet: string): CellValue[][] {
    const name = this.sheetName(sheet) ?? sheet;
    const k = name.toLowerCase();
    let g = this.grids.get(k);
    if (!g) {
      g = this.book.usedGrid(name);
      this.grids.set(k, g);
    }
    return g;
  }

  /** One cell as the grid shows it. */
  cell(sheet: string, row: number, column: number): CellView {
    const raw = this.grid(sheet)[row]?.[column] ?? null;
    const format = this.format(sheet, row, column);
    if (typeof raw === 'string' && raw.startsWith('=')) {
      const result = this.calc.result(sheet, row, column);
      return { raw, value: result?.value ?? null, result, spilled: false, format };
    }
    if (raw === null) {
      const v = this.calc.spilled(sheet, row, column);
      return { raw, value: v ?? null, spilled: v !== undefined, format };
    }
    return { raw, value: raw, spilled: false, format };
  }

  /** The number format of one cell (null: General). */
  format(sheet: string, row: number, column: number): NumberFormat {
    const name = this.sheetName(sheet) ?? sheet;
    const k = name.toLowerCase();
    let m = this.formatCache.get(k);
    if (!m) {
      m = new Map();
      for (const b of this.blocks) {
        if (b.sheet.toLowerCase() !== k || !b.formats) continue;
        b.formats.forEach((line, i) => line.forEach((f, j) => { const at = `${b.row + i},${b.column + j}`; if (f) m!.set(at, f); else m!.delete(at); }));
      }
      this.formatCache.set(k, m);
    }
    return m.get(`${row},${column}`) ?? null;
  }

  /** The used size of a sheet including what its formulas spill. */
  extent(sheet: string): { rows: number; columns: number } {
    const g = this.grid(sheet);
    let rows = g.length, columns = g[0]?.length ?? 0;
    for (const { cell, result } of this.calc.results()) {
      if (cell.sheet.toLowerCase() !== sheet.toLowerCase() || !result?.spill) continue;
      rows = Math.max(rows, cell.row + result.spill.rows);
      columns = Math.max(columns, cell.column + result.spill.columns);
    }
    return { rows, columns };
  }

  charts(sheet: string): RecordedChart[] {
    return this.book.charts.filter((c) => c.sheet.toLowerCase() === sheet.toLowerCase());
  }

  /** Every formula result of the last recalculation. */
  results(): ReturnType<Calculation['results']> {
    return this.calc.results();
  }

  /** The sheet's own name for a name in any case. */
  sheetName(name: string | undefined): string | undefined {
    if (name === undefined) return undefined;
    const wanted = name.toLowerCase();
    return this.names.find((n) => n.toLowerCase() === wanted);
  }

  /** Forgets the workbook file (the next load opens the demo as it was). */
  forget(): void {
    this.file?.clear();
  }

  // ---- inside -----------------------------------------------------------------------------

  private async read(address: string, values: boolean): Promise<CellValue[][]> {
    const r = parseA1(address);
    const sheet = this.sheetName(r.sheet) ?? (r.sheet === undefined ? this.activeSheet() : r.sheet);
    if (this.formulaCells.has(sheet.toLowerCase()) || this.calc.touches(sheet)) await this.settled();
    const grid = await this.book.readFormulas(address);
    if (!this.calc.touches(sheet)) return values ? grid.map((row, i) => row.map((v, j) => this.formulaValue(sheet, r.row + i, r.column + j, v))) : grid;
    return grid.map((row, i) => row.map((v, j) => {
      if (v === null) return this.calc.spilled(sheet, r.row + i, r.column + j) ?? null;
      return values ? this.formulaValue(sheet, r.row + i, r.column + j, v) : v;
    }));
  }

  private formulaValue(sheet: string, row: number, column: number, v: CellValue): CellValue {
    return typeof v === 'string' && v.startsWith('=') ? this.calc.result(sheet, row, column)?.value ?? null : v;
  }

  private valueAt(sheet: string, row: number, column: number): CellValue {
    return this.calc.result(sheet, row, column)?.value ?? null;
  }

  private schedule(): void {
    this.dirty = true;
    if (this.running) return;
    this.running = (async () => {
      await new Promise((resolve) => setTimeout(resolve, 0)); // writes that come together, one recalculation
      while (this.dirty) {
        this.dirty = false;
        this.emit('calculating');
        try {
          this.calc = await calculate(this.source(), this.functions, this.cache);
        } catch (err) {
          console.error('the preview could not recalculate', err);
        }
        this.calculations++;
      }
      this.running = undefined;
      this.emit('cells');
    })();
  }

  private source(): CellSource {
    const cells: FormulaCell[] = [];
    for (const m of this.formulaCells.values()) cells.push(...m.values());
    return {
      sheetName: (name) => this.sheetName(name),
      raw: (sheet, row, column) => {
        const v = this.grid(sheet)[row]?.[column];
        return v === null || v === undefined || v === '' ? undefined : v;
      },
      formulas: () => cells,
      version: (sheet) => this.versions.get(sheet.toLowerCase()) ?? 0,
      modelsVersion: () => this.modelsVersion,
    };
  }

  private applyBlock(block: WrittenBlock): void {
    const sheet = this.sheetName(block.sheet);
    if (!sheet) return;
    const address = formatA1({ sheet, row: block.row, column: block.column, rows: block.values.length, columns: block.values[0].length });
    try {
      parseA1(address);
    } catch {
      return; // a block that no longer fits is left out
    }
    // MemoryWorkbook writes at once; its promise only carries the outcome
    this.book.writeRange(address, block.values, block.formats).catch(() => undefined);
    this.applyTracking(sheet, block.row, block.column, block.values);
    this.blocks = addBlock(this.blocks, block);
  }

  private applyTracking(sheet: string, row: number, column: number, values: CellValue[][]): void {
    const k = sheet.toLowerCase();
    this.grids.delete(k);
    this.versions.set(k, (this.versions.get(k) ?? 0) + 1);
    values.forEach((line, i) => line.forEach((v, j) => this.track(sheet, row + i, column + j, v)));
  }

  private track(sheet: string, row: number, column: number, v: CellValue): void {
    const k = sheet.toLowerCase();
    const at = `${row},${column}`;
    if (typeof v === 'string' && v.startsWith('=')) {
      let m = this.formulaCells.get(k);
      if (!m) this.formulaCells.set(k, (m = new Map()));
      m.set(at, { sheet, row, column, formula: v });
    } else {
      const m = this.formulaCells.get(k);
      if (m?.delete(at) && m.size === 0) this.formulaCells.delete(k);
    }
  }

  private addSheetName(name: string): void {
    // the rule MemoryWorkbook applies; a stored name it would refuse is left out
    if (this.sheetName(name) || name.trim() === '' || name.length > 31 || /[:\\/?*[\]]/.test(name)) return;
    this.book.ensureSheet(name).catch(() => undefined);
    this.names.push(name);
  }

  private addedSheets(): string[] {
    return this.names.filter((n) => !this.initial.has(n.toLowerCase()));
  }

  private save(part: 'models' | 'sheets' | 'blocks' | 'charts', value: unknown): void {
    if (!this.file) return;
    const problem = this.file.write(part, value);
    if (problem !== this.storageProblem) {
      this.storageProblem = problem;
      this.emit('storage');
    }
  }

  private emit(event: PreviewEvent): void {
    for (const l of [...this.listeners]) {
      try { l(event); } catch (err) { console.error(err); }
    }
  }
}
