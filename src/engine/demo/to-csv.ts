import type { DemoRow } from './generate-market';

const DECIMALS: Record<string, number> = { price: 2, temperature_forecast: 1 };

/**
 * Writes demo rows as the Spotloom data file: UTF-8 CSV, header row, comma
 * separator, `.` decimal; columns `timestamp,price,<drivers…>` in the rows'
 * key order. Price has 2 decimals, temperature 1, load and other MW drivers
 * 0. An unknown value (NaN) is written as an empty cell.
 *
 * @param rows - rows from generateMarket (all with the same columns)
 * @returns the CSV text, one line per row, ending in a newline
 * @example toCsv(generateMarket(DEMO_MARKET, 1)).split('\n')[0] // 'timestamp,price,temperature_forecast,load_forecast'
 */
export function toCsv(rows: readonly DemoRow[]): string {
  const columns = rows.length > 0 ? Object.keys(rows[0]) : ['timestamp', 'price'];
  const lines = [columns.join(',')];
  for (const row of rows) {
    const record = row as unknown as Record<string, string | number | undefined>;
    lines.push(
      columns
        .map((c) => {
          const v = record[c];
          if (c === 'timestamp') return String(v);
          if (typeof v !== 'number' || Number.isNaN(v)) return '';
          const text = v.toFixed(DECIMALS[c] ?? 0);
          return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
        })
        .join(','),
    );
  }
  return lines.join('\n') + '\n';
}
