import type { CellValue } from '../host/workbook-port';
import type { PreviewWorkbook } from './preview-workbook';

/**
 * A read-only look into the preview workbook from the browser's console
 * (`spotloomPreview` on the preview page), for people who want to see what
 * the pane wrote, and for the end-to-end tests. It reads; it never writes.
 *
 * @example await spotloomPreview.readRange('Outlook!J7:J8')
 */
export interface PreviewInspector {
  readRange(address: string): Promise<CellValue[][]>;
  readFormulas(address: string): Promise<CellValue[][]>;
  /** resolves when no recalculation is running */
  settled(): Promise<void>;
  sheets(): string[];
  /** names of the saved models */
  models(): Promise<string[]>;
  /** the used cells of every sheet, as written */
  grid(sheet: string): CellValue[][];
  /** a short tag of every sheet's cells and every model text: equal tags, same workbook */
  fingerprint(): Promise<string>;
  /** finished recalculations so far */
  calculations(): number;
}

export function inspector(port: PreviewWorkbook): PreviewInspector {
  const copy = (g: CellValue[][]) => g.map((row) => row.slice());
  return Object.freeze({
    readRange: async (address: string) => copy(await port.readRange(address)),
    readFormulas: async (address: string) => copy(await port.readFormulas(address)),
    settled: () => port.settled(),
    sheets: () => port.sheetNames(),
    models: async () => Object.keys(await port.loadModels()).sort(),
    grid: (sheet: string) => copy(port.grid(sheet)),
    fingerprint: async () => {
      const models = await port.loadModels();
      const parts = port.sheetNames().map((s) => `${s}:${JSON.stringify(port.grid(s))}`);
      parts.push(...Object.keys(models).sort().map((name) => `model ${name}:${models[name]}`));
      return fnv1a(parts.join('\n'));
    },
    calculations: () => port.calculations,
  });
}

/** 32-bit FNV-1a of a text, hex (Fowler–Noll–Vo hash, FNV-1a variant, IETF draft-eastlake-fnv). */
export function fnv1a(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}
