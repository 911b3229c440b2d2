import type { Page } from 'playwright-core';
import type { CellValue } from '../../../src/host/workbook-port';

/**
 * Small helpers over the preview page: its console handle
 * (window.spotloomPreview, src/preview/inspector.ts) and the grid's name box
 * and formula bar, which a user would use to look at a cell.
 */
export interface PreviewPage {
  page: Page;
  /** waits until the workbook is open and no recalculation is running */
  settled(): Promise<void>;
  readRange(address: string): Promise<CellValue[][]>;
  readFormulas(address: string): Promise<CellValue[][]>;
  models(): Promise<string[]>;
  fingerprint(): Promise<string>;
  /** goes to a cell through the name box; returns what the formula bar says of it */
  lookAt(address: string): Promise<{ value: string; error: string | null; formula: string }>;
  /** the stored model texts in the page's localStorage (the preview's workbook file) */
  storedModels(): Promise<Record<string, string>>;
}

export function previewPage(page: Page): PreviewPage {
  const handle = <T>(fn: string, ...args: unknown[]) =>
    page.evaluate(([f, a]) => {
      const api = (window as unknown as { spotloomPreview: Record<string, (...x: unknown[]) => unknown> }).spotloomPreview;
      return api[f as string](...(a as unknown[]));
    }, [fn, args] as const) as Promise<T>;
  return {
    page,
    async settled() {
      await page.waitForSelector('#spotloom-preview[data-ready="true"]');
      await handle('settled');
      await page.waitForSelector('[data-test="calc-status"][data-state="ready"]');
    },
    readRange: (address) => handle('readRange', address),
    readFormulas: (address) => handle('readFormulas', address),
    models: () => handle('models'),
    fingerprint: () => handle('fingerprint'),
    async lookAt(address) {
      await handle('settled');
      const box = page.locator('[data-test="name-box"]');
      await box.fill(address);
      await box.press('Enter');
      const out = page.locator('[data-test="cell-value"]');
      return {
        value: (await out.getAttribute('data-value')) ?? '',
        error: await out.getAttribute('data-error'),
        formula: await page.locator('[data-test="formula-input"]').inputValue(),
      };
    },
    storedModels: () => page.evaluate(() => JSON.parse(localStorage.getItem('spotloom-preview/v1/models') ?? '{}') as Record<string, string>),
  };
}

/** Numbers of a one-column range as read from the page: empty cells are NaN (unknown). */
export function column(values: CellValue[][]): number[] {
  return values.map((row) => (typeof row[0] === 'number' ? row[0] : NaN));
}

/** The ranges (with sheet) a LOOM formula refers to, in order. */
export function referencesOf(formula: string): string[] {
  return [...formula.matchAll(/((?:'[^']+'|[A-Za-z0-9_]+)!\$?[A-Z]+\$?\d+(?::\$?[A-Z]+\$?\d+)?)/g)].map((m) => m[1].replace(/\$/g, ''));
}
