import { writeFileSync } from 'node:fs';
import { InputError } from '../engine';

/** Writes rows of cells as CSV; a number that is NaN becomes an empty cell. */
export function writeCsv(file: string, header: string[], rows: (string | number)[][]): void {
  const lines = [header.join(',')];
  for (const row of rows) lines.push(row.map(cell).join(','));
  try {
    writeFileSync(file, `${lines.join('\n')}\n`);
  } catch (err) {
    throw new InputError(`cannot be written (${(err as NodeJS.ErrnoException).code ?? 'unknown error'})`, { file });
  }
}

function cell(v: string | number): string {
  if (typeof v === 'string') return /[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
  return Number.isFinite(v) ? String(Math.round(v * 1e6) / 1e6) : '';
}
