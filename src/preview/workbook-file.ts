import type { CellValue, NumberFormat } from '../host/workbook-port';

/**
 * The preview's "workbook file": what a real workbook would carry when saved,
 * kept in the browser's localStorage of the preview's own origin, so a
 * reload finds it again. Nothing leaves the machine.
 *
 * - models: name → stored model text, exactly as the port was given them
 *   (every text is validated again by the host's ModelStore when it is
 *   loaded, so a text edited by hand in the storage is refused, not used);
 * - sheets added to the demo workbook (by the pane, or by a CSV import);
 * - cell writes, in order, as rectangular blocks; a block that a later
 *   block covers completely is dropped, so rewriting the same range again
 *   and again does not grow the file;
 * - the native charts the pane asked for.
 *
 * Each part has its own key, so a cell part too big for the storage (a
 * large CSV import) never costs the models. Whatever is read back is
 * checked for its shape and anything else is ignored.
 *
 * @example new WorkbookFile(window.localStorage).read().models
 */
export interface WrittenBlock {
  sheet: string;
  /** 0-based top-left cell */
  row: number;
  column: number;
  values: CellValue[][];
  /** number formats of the same cells, when the write carried them */
  formats?: NumberFormat[][];
}

export interface SavedChart {
  sheet: string;
  address: string;
  title: string;
}

export interface SavedWorkbook {
  models: Record<string, string>;
  sheets: string[];
  blocks: WrittenBlock[];
  charts: SavedChart[];
}

/** The part of the Web Storage interface the file uses. */
export interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

export const FILE_PREFIX = 'spotloom-preview/v1/';
const PARTS = ['models', 'sheets', 'blocks', 'charts'] as const;
/** names that would reach an object's prototype rather than name a model (the model schema refuses them too) */
const UNSAFE_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
type Part = (typeof PARTS)[number];

export class WorkbookFile {
  constructor(private readonly storage: KeyValueStorage | undefined, private readonly prefix = FILE_PREFIX) {}

  read(): SavedWorkbook {
    const models: Record<string, string> = {};
    const stored = this.part('models');
    if (isRecord(stored)) {
      for (const [name, text] of Object.entries(stored)) {
        if (typeof text === 'string' && !UNSAFE_KEYS.has(name)) models[name] = text;
      }
    }
    const sheets = asArray(this.part('sheets')).filter((s): s is string => typeof s === 'string');
    const blocks = asArray(this.part('blocks')).filter(isBlock);
    const charts = asArray(this.part('charts')).filter((c): c is SavedChart =>
      isRecord(c) && typeof c.sheet === 'string' && typeof c.address === 'string' && typeof c.title === 'string');
    return { models, sheets, blocks, charts };
  }

  /** @returns undefined when saved, else why not (one line) */
  write(part: Part, value: unknown): string | undefined {
    if (!this.storage) return 'this browser gives the page no storage, so nothing is kept across reloads';
    try {
      this.storage.setItem(this.prefix + part, JSON.stringify(value));
      return undefined;
    } catch (err) {
      const what = part === 'blocks' ? 'the written cells' : part;
      return `the browser's storage refused ${what} (${err instanceof Error ? err.name : 'error'}): they are lost on reload; reset the workbook or import a smaller file`;
    }
  }

  /** Forgets everything (the demo workbook comes back as it was). */
  clear(): void {
    for (const part of PARTS) {
      try { this.storage?.removeItem(this.prefix + part); } catch { /* nothing kept, nothing to clear */ }
    }
  }

  private part(part: Part): unknown {
    try {
      const text = this.storage?.getItem(this.prefix + part);
      return text ? JSON.parse(text) : undefined;
    } catch {
      return undefined;
    }
  }
}

/**
 * Adds a block to the list, dropping earlier blocks of the same sheet that
 * it covers completely.
 */
export function addBlock(blocks: WrittenBlock[], block: WrittenBlock): WrittenBlock[] {
  const rows = block.values.length, columns = block.values[0]?.length ?? 0;
  const covered = (b: WrittenBlock) => b.sheet.toLowerCase() === block.sheet.toLowerCase()
    && b.row >= block.row && b.column >= block.column
    && b.row + b.values.length <= block.row + rows
    && b.column + (b.values[0]?.length ?? 0) <= block.column + columns;
  return [...blocks.filter((b) => !covered(b)), block];
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function asArray(v: unknown): unknown[] {
  return Array.isArray(v) ? v : [];
}

function isCell(v: unknown): v is CellValue {
  return v === null || typeof v === 'string' || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v));
}

function isBlock(v: unknown): v is WrittenBlock {
  if (!isRecord(v) || typeof v.sheet !== 'string') return false;
  if (!Number.isInteger(v.row) || !Number.isInteger(v.column) || (v.row as number) < 0 || (v.column as number) < 0) return false;
  const values = v.values;
  if (!Array.isArray(values) || values.length === 0 || !Array.isArray(values[0])) return false;
  const width = (values[0] as unknown[]).length;
  if (!(width > 0 && values.every((row) => Array.isArray(row) && row.length === width && row.every(isCell)))) return false;
  const formats = v.formats;
  if (formats === undefined) return true;
  return Array.isArray(formats) && formats.length === values.length
    && formats.every((row) => Array.isArray(row) && row.length === width && row.every((f) => f === null || (typeof f === 'string' && f.length < 64)));
}
