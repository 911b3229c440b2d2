import { InputError } from '../engine';
import { formatA1, parseA1, type A1Range } from './a1';
import type { CellValue, NumberFormat, WorkbookPort } from './workbook-port';

/**
 * An in-memory workbook behind the WorkbookPort: sheets are sparse grids
 * (only non-empty cells are kept), models live in a Map, charts are
 * recorded in a list. The standalone preview and the tests use it; it
 * behaves like the Office adapter where the port's contract says so
 * (sheet names match without regard to case, an address without a sheet
 * means the active sheet, a write must fit its address exactly).
 *
 * A cell written with a string beginning with `=` holds a formula; reading
 * its value asks `evaluate` (the preview's small evaluator) and gives
 * `null` without one.
 *
 * @example new MemoryWorkbook({ sheets: { History: [['timestamp', 'price']] } }).readRange('History!A1:B1')
 */
export interface MemoryWorkbookOptions {
  /** initial sheets, each grid placed from A1; the first one is active */
  sheets?: Record<string, CellValue[][]>;
  dateSystem?: '1900' | '1904';
  /** the current selection; the first sheet's A1 by default */
  selection?: string;
  /** models already stored in the workbook, name → text */
  models?: Record<string, string>;
  /** value of a formula cell */
  evaluate?: (formula: string, at: { sheet: string; row: number; column: number }) => CellValue;
  /** called by recalculate() */
  onRecalculate?: () => void;
  /** rows × columns a formula cell's result fills (the preview's evaluator knows); one cell without it */
  spill?: (at: { sheet: string; row: number; column: number }) => { rows: number; columns: number } | undefined;
}

export interface RecordedChart {
  sheet: string;
  address: string;
  title: string;
}

interface Sheet {
  name: string;
  cells: Map<string, CellValue>;
  /** number formats by cell; a cell without one is General */
  formats: Map<string, string>;
}

export class MemoryWorkbook implements WorkbookPort {
  readonly kind = 'memory';
  readonly charts: RecordedChart[] = [];
  /** how often recalculate() was asked for (the preview re-evaluates its formula cells on it) */
  recalculations = 0;
  private readonly onRecalculate?: () => void;
  private readonly sheets: Sheet[] = [];
  private readonly models = new Map<string, string>();
  private readonly system: '1900' | '1904';
  private readonly evaluate?: MemoryWorkbookOptions['evaluate'];
  private readonly spill?: MemoryWorkbookOptions['spill'];
  private selection: string;
  private active = 0;

  constructor(options: MemoryWorkbookOptions = {}) {
    this.system = options.dateSystem ?? '1900';
    this.evaluate = options.evaluate;
    this.spill = options.spill;
    this.onRecalculate = options.onRecalculate;
    for (const [name, grid] of Object.entries(options.sheets ?? {})) {
      const sheet = this.addSheet(name);
      grid.forEach((row, r) => row.forEach((v, c) => setCell(sheet, r, c, v)));
    }
    if (this.sheets.length === 0) this.addSheet('Sheet1');
    for (const [name, text] of Object.entries(options.models ?? {})) this.models.set(name, text);
    this.selection = options.selection ?? formatA1({ sheet: this.sheets[0].name, row: 0, column: 0, rows: 1, columns: 1 });
    this.activate(parseA1(this.selection).sheet);
  }

  async dateSystem(): Promise<'1900' | '1904'> {
    return this.system;
  }

  async selectedAddress(): Promise<string> {
    const r = parseA1(this.selection);
    return formatA1({ ...r, sheet: r.sheet ?? this.sheets[this.active].name });
  }

  /** Selects a range (and activates its sheet), as a user would. */
  select(address: string): void {
    const r = parseA1(address);
    this.activate(r.sheet);
    this.selection = formatA1({ ...r, sheet: this.sheets[this.active].name });
  }

  async readRange(address: string): Promise<CellValue[][]> {
    return this.read(address, (sheet, row, column, v) =>
      typeof v === 'string' && v.startsWith('=') ? this.evaluate?.(v, { sheet: sheet.name, row, column }) ?? null : v);
  }

  async readFormulas(address: string): Promise<CellValue[][]> {
    return this.read(address, (_s, _r, _c, v) => v);
  }

  async writeRange(address: string, values: CellValue[][], formats?: NumberFormat[][]): Promise<void> {
    const r = parseA1(address);
    const sheet = this.sheet(r.sheet);
    if (values.length !== r.rows || values.some((row) => row.length !== r.columns)) {
      throw new InputError(`${address} has ${r.rows} × ${r.columns} cells but ${values.length} × ${values[0]?.length ?? 0} values were given`);
    }
    if (formats && (formats.length !== r.rows || formats.some((row) => row.length !== r.columns))) {
      throw new InputError(`${address} has ${r.rows} × ${r.columns} cells but ${formats.length} × ${formats[0]?.length ?? 0} number formats were given`);
    }
    values.forEach((row, i) => row.forEach((v, j) => setCell(sheet, r.row + i, r.column + j, v)));
    // as in the host, a write without formats leaves the cells' formats as they were
    formats?.forEach((row, i) => row.forEach((f, j) => {
      const key = `${r.row + i},${r.column + j}`;
      if (f === null || f === '' || f === 'General') sheet.formats.delete(key); else sheet.formats.set(key, f);
    }));
  }

  /** Number formats of a range (null: General), as the host's numberFormat gives them. */
  async readFormats(address: string): Promise<NumberFormat[][]> {
    const r = parseA1(address);
    const sheet = this.sheet(r.sheet);
    return Array.from({ length: r.rows }, (_, i) => Array.from({ length: r.columns }, (_, j) => sheet.formats.get(`${r.row + i},${r.column + j}`) ?? null));
  }

  async listSheets(): Promise<string[]> {
    return this.sheets.map((s) => s.name);
  }

  async ensureSheet(name: string): Promise<void> {
    if (!this.find(name)) this.addSheet(name);
  }

  async usedAddress(name: string): Promise<string | undefined> {
    const sheet = this.sheet(name);
    let rows = 0, columns = 0;
    for (const key of sheet.cells.keys()) {
      const [r, c] = key.split(',').map(Number);
      const size = this.spillSize(sheet, r, c);
      rows = Math.max(rows, r + size.rows);
      columns = Math.max(columns, c + size.columns);
    }
    return rows === 0 ? undefined : formatA1({ sheet: sheet.name, row: 0, column: 0, rows, columns });
  }

  async spillRanges(cells: string[]): Promise<string[]> {
    return cells.map((address) => {
      const r = parseA1(address);
      const sheet = this.sheet(r.sheet);
      return formatA1({ sheet: sheet.name, row: r.row, column: r.column, ...this.spillSize(sheet, r.row, r.column) });
    });
  }

  async loadModels(): Promise<Record<string, string>> {
    return Object.fromEntries(this.models);
  }

  async saveModel(name: string, text: string): Promise<void> {
    this.models.set(name, text);
  }

  async deleteModel(name: string): Promise<void> {
    this.models.delete(name);
  }

  async addLineChart(sheet: string, address: string, title: string): Promise<void> {
    const r = parseA1(address);
    const s = this.sheet(sheet);
    const same = this.charts.findIndex((c) => c.sheet === s.name && c.title === title);
    if (same >= 0) this.charts.splice(same, 1);
    this.charts.push({ sheet: s.name, address: formatA1({ ...r, sheet: undefined }), title });
  }

  async recalculate(): Promise<void> {
    this.recalculations++;
    this.onRecalculate?.();
  }

  /**
   * The used part of a sheet as a dense grid from A1 to its last non-empty
   * cell, formulas as written (for the preview's grid view).
   */
  usedGrid(name: string): CellValue[][] {
    const sheet = this.sheet(name);
    let rows = 0, columns = 0;
    for (const key of sheet.cells.keys()) {
      const [r, c] = key.split(',').map(Number);
      rows = Math.max(rows, r + 1);
      columns = Math.max(columns, c + 1);
    }
    return Array.from({ length: rows }, (_, r) => Array.from({ length: columns }, (_, c) => sheet.cells.get(`${r},${c}`) ?? null));
  }

  private spillSize(sheet: Sheet, row: number, column: number): { rows: number; columns: number } {
    const v = sheet.cells.get(`${row},${column}`);
    const isFormula = typeof v === 'string' && v.startsWith('=');
    return (isFormula && this.spill?.({ sheet: sheet.name, row, column })) || { rows: 1, columns: 1 };
  }

  private read(address: string, view: (sheet: Sheet, row: number, column: number, v: CellValue) => CellValue): CellValue[][] {
    const r: A1Range = parseA1(address);
    const sheet = this.sheet(r.sheet);
    return Array.from({ length: r.rows }, (_, i) =>
      Array.from({ length: r.columns }, (_, j) => {
        const v = sheet.cells.get(`${r.row + i},${r.column + j}`);
        return v === undefined ? null : view(sheet, r.row + i, r.column + j, v);
      }));
  }

  private sheet(name: string | undefined): Sheet {
    if (name === undefined) return this.sheets[this.active];
    const hit = this.find(name);
    if (!hit) throw new InputError(`the workbook has no sheet named "${name}" (sheets: ${this.sheets.map((s) => s.name).join(', ')})`);
    return hit;
  }

  private find(name: string): Sheet | undefined {
    const wanted = name.toLowerCase();
    return this.sheets.find((s) => s.name.toLowerCase() === wanted);
  }

  private addSheet(name: string): Sheet {
    if (name.trim() === '' || name.length > 31 || /[:\\/?*[\]]/.test(name)) {
      throw new InputError(`"${name}" cannot name a sheet: use 1 to 31 characters without : \\ / ? * [ ]`);
    }
    const sheet = { name, cells: new Map<string, CellValue>(), formats: new Map<string, string>() };
    this.sheets.push(sheet);
    return sheet;
  }

  private activate(name: string | undefined): void {
    if (name !== undefined) this.active = this.sheets.indexOf(this.sheet(name));
  }
}

function setCell(sheet: Sheet, row: number, column: number, v: CellValue): void {
  const key = `${row},${column}`;
  if (v === null || v === '' || v === undefined) sheet.cells.delete(key);
  else sheet.cells.set(key, v);
}
