import { hhmm, serialToWallClock } from '../engine';
import type { CellValue, NumberFormat } from '../host/workbook-port';

/**
 * How the preview grid writes a value in a cell: numbers rounded for the
 * eye (two decimals; small magnitudes such as p-values to four significant
 * digits), booleans as TRUE/FALSE, empty as nothing. The exact value stays
 * in the cell's data-value attribute and in the formula bar.
 *
 * A number with a number format shows as the host shows it for the format
 * codes Spotloom writes (fixed decimals `0.00`, per cent `0.0%`, date-time
 * `yyyy-mm-dd hh:mm` of a 1900-system serial; ECMA-376 Part 1, 18.8.31);
 * other codes fall back to the rule above.
 *
 * @example cellText(41.23456) // '41.23'
 * @example cellText(0.0123456) // '0.01235'
 * @example cellText(0.8958, '0.0%') // '89.6%'
 */
export function cellText(v: CellValue, format: NumberFormat = null): string {
  if (v === null) return '';
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (typeof v === 'string') return v;
  if (!Number.isFinite(v)) return String(v);
  const fixed = format ? /^0(?:\.(0+))?(%?)$/.exec(format) : null;
  if (fixed) return fixed[2] ? `${(100 * v).toFixed(fixed[1]?.length ?? 0)}%` : v.toFixed(fixed[1]?.length ?? 0);
  if (format === 'yyyy-mm-dd hh:mm' && v >= 1) {
    const wall = serialToWallClock(v);
    return `${wall.date} ${hhmm(wall.minutes)}`;
  }
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
