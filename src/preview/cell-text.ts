import type { CellValue } from '../host/workbook-port';

/**
 * How the preview grid writes a value in a cell: numbers rounded for the
 * eye (two decimals; small magnitudes such as p-values to four significant
 * digits), booleans as TRUE/FALSE, empty as nothing. The exact value stays
 * in the cell's data-value attribute and in the formula bar.
 *
 * @example cellText(41.23456) // '41.23'
 * @example cellText(0.0123456) // '0.01235'
 */
export function cellText(v: CellValue): string {
  if (v === null) return '';
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (typeof v === 'string') return v;
  if (!Number.isFinite(v)) return String(v);
  if (Number.isInteger(v)) return String(v);
  const a = Math.abs(v);
  if (a >= 1e9) return v.toExponential(3);
  if (a < 1) return String(Number(v.toPrecision(4)));
  return String(Math.round(v * 100) / 100);
}

/**
 * What a typed entry becomes in a cell: `=…` a formula, a plain number a
 * number (`.` decimal), TRUE/FALSE a boolean, nothing an empty cell, any
 * other text itself.
 *
 * @example typedValue(' 12.5 ') // 12.5
 */
export function typedValue(text: string): CellValue {
  const t = text.trim();
  if (t === '') return null;
  if (t.startsWith('=')) return t;
  if (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(t)) {
    const n = Number(t);
    if (Number.isFinite(n)) return n;
  }
  if (/^(true|false)$/i.test(t)) return t.toUpperCase() === 'TRUE';
  return text;
}
