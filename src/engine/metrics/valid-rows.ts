import { InputError } from '../errors';

/**
 * Lines up equal-length columns (actual, forecast, ...) and keeps the rows in
 * which no column is NaN. This is the one missing-value rule of every metric:
 * NaN means unknown, so a period with an unknown actual or forecast value is
 * skipped, never counted as zero.
 *
 * @param metric - name used in error messages, e.g. `"MAE"`
 * @param names - one label per column, e.g. `["actual", "forecast"]`
 * @param columns - the columns, all of the same length
 * @returns the columns with the incomplete rows removed (column-major)
 * @throws {InputError} when the lengths differ, when a value is ±Infinity, or
 *   when no row is complete
 * @example validRows('MAE', ['actual', 'forecast'], [[1, NaN, 3], [2, 2, NaN]]) // [[1], [2]]
 * Source: common practice (NaN-skipping as in d3-array's summary functions).
 */
export function validRows(
  metric: string,
  names: readonly string[],
  columns: readonly (readonly number[])[],
): number[][] {
  const length = columns[0].length;
  if (columns.some((c) => c.length !== length)) {
    throw new InputError(
      `${metric} requires ${listWords(names)} of the same length (got ${listWords(columns.map((c) => String(c.length)))})`,
    );
  }
  const kept: number[][] = columns.map(() => []);
  for (let i = 0; i < length; i++) {
    let complete = true;
    for (let c = 0; c < columns.length; c++) {
      const value = columns[c][i];
      if (Number.isNaN(value)) complete = false;
      else if (!Number.isFinite(value)) {
        throw new InputError(
          `${metric}: ${names[c]} value ${i + 1} is ${value}; give a finite number, or NaN for unknown`,
        );
      }
    }
    if (complete) columns.forEach((c, k) => kept[k].push(c[i]));
  }
  if (kept[0].length === 0) {
    const what =
      names.length === 2
        ? `pair of ${names[0]} and ${names[1]} values`
        : `period where ${listWords(names)} are all known`;
    throw new InputError(`${metric} requires at least 1 ${what}`);
  }
  return kept;
}

function listWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
