/**
 * The small interface between Spotloom and a workbook. Two implementations:
 * the Office.js one (office-workbook.ts) and an in-memory one
 * (memory-workbook.ts) that the standalone preview and the tests use. The
 * pane and the cell functions only ever talk to this interface.
 *
 * Addresses are A1 style, optionally with a sheet: `History!A2:C900`; an
 * address without a sheet means the active sheet.
 * Values are rows × columns; an empty cell reads as `null`, and writing
 * `null` (or `''`) leaves the cell empty.
 *
 * Models are stored in the workbook itself (office-workbook.ts says where),
 * one text per model name; model-store.ts validates every text on load.
 */
export type CellValue = string | number | boolean | null;

/**
 * A cell's number format, in the host's format-code language (ECMA-376
 * Part 1, 18.8.31): `0.00`, `0.0%`, `yyyy-mm-dd hh:mm`; null is the host's
 * General format.
 */
export type NumberFormat = string | null;

export interface WorkbookPort {
  readonly kind: 'office' | 'memory';
  /** the workbook's date system: serial 0 is 1899-12-30 (1900) or 1904-01-01 (1904) */
  dateSystem(): Promise<'1900' | '1904'>;
  /** address (with sheet) of the current selection */
  selectedAddress(): Promise<string>;
  readRange(address: string): Promise<CellValue[][]>;
  /** formulas of a range (a cell without a formula gives its value) */
  readFormulas(address: string): Promise<CellValue[][]>;
  /**
   * Writes values; a string beginning with `=` is a formula. With `formats`
   * (the same rows × columns), each cell also gets that number format; the
   * cells a formula spills into show their own cell's format, so a spill
   * area is formatted by formatting its cells. Do not call it directly:
   * every write goes through writeWithConsent (safe-write.ts).
   */
  writeRange(address: string, values: CellValue[][], formats?: NumberFormat[][]): Promise<void>;
  listSheets(): Promise<string[]>;
  /**
   * Address (with sheet) of the sheet's used cells, from A1 to the last
   * row and column holding a value, a formula or a spilled value (so that
   * everything written there lies inside it); undefined for an empty sheet.
   */
  usedAddress(sheet: string): Promise<string | undefined>;
  /**
   * For each formula cell (an address with sheet), the range its result
   * fills: the cell and the cells it spills into, or the cell alone when the
   * result is one value (or the formula could not spill).
   */
  spillRanges(cells: string[]): Promise<string[]>;
  /** adds the sheet when missing; never clears an existing one */
  ensureSheet(name: string): Promise<void>;
  /** stored model texts by model name, as saved in this workbook */
  loadModels(): Promise<Record<string, string>>;
  saveModel(name: string, text: string): Promise<void>;
  deleteModel(name: string): Promise<void>;
  /** a native line chart of the columns in `address` (first column: categories); it replaces a chart of the same title on that sheet */
  addLineChart(sheet: string, address: string, title: string): Promise<void>;
  /**
   * Recalculates the workbook's formulas, so that LOOM cells pick up a model
   * that was saved, replaced, renamed or deleted (model-store.ts calls it).
   * Optional: a port without it simply leaves recalculation to the host.
   */
  recalculate?(): Promise<void>;
}

/** Asks the user a yes/no question; the pane shows it as a dialog. */
export type AskUser = (question: string) => Promise<boolean>;
