import { toWallClock, wallClockToSerial } from '../../engine';
import type { CellValue, NumberFormat } from '../../host/workbook-port';
import { DATE_1904_OFFSET } from './cell-time';

/**
 * The number formats of the cells Spotloom writes (the host's format codes,
 * ECMA-376 Part 1, 18.8.31), so a sheet shows what the pane shows: prices
 * and errors in price units with two decimals, shares (band coverage) as
 * per cent with one decimal, rMAE with three decimals, delivery starts as
 * date-time in the market zone.
 */
export const PRICE_FORMAT = '0.00';
export const SHARE_FORMAT = '0.0%';
export const RATIO_FORMAT = '0.000';
export const DATETIME_FORMAT = 'yyyy-mm-dd hh:mm';

/**
 * A delivery start as a date-time cell: the wall-clock time in the market
 * zone as a serial of the workbook's date system. (On the day the clocks go
 * back, the repeated hour shows the same clock time twice, as a wall clock
 * does; the archive keeps exact instants as text, see archive.ts.)
 *
 * @example timeCell(Date.parse('2025-06-02T00:00:00+02:00'), 'Europe/Berlin', '1900') // 45810
 */
export function timeCell(ms: number, zone: string, dateSystem: '1900' | '1904'): CellValue {
  return wallClockToSerial(toWallClock(ms, zone)) - (dateSystem === '1904' ? DATE_1904_OFFSET : 0);
}

/** Formats for a block of rows × columns, one format per column (null: General), text rows (headers) left General. */
export function columnFormats(values: CellValue[][], columns: NumberFormat[], textRows: number[] = []): NumberFormat[][] {
  return values.map((row, i) => row.map((_, j) => (textRows.includes(i) ? null : columns[j] ?? null)));
}
