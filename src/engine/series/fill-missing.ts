/**
 * Fills unknown values of a days × slots matrix, in place, by one rule:
 * a NaN takes the value of the same clock slot on the nearest earlier day
 * that has one. It only ever looks back, so filling is safe inside a
 * backtest; values before the first known one stay NaN.
 *
 * @returns how many cells were filled
 * @example fillFromEarlierDays([[1, 2], [NaN, 4]]) // 1; row 1 becomes [1, 4]
 */
export function fillFromEarlierDays(rows: Float64Array[]): number {
  if (rows.length === 0) return 0;
  const last = new Float64Array(rows[0].length).fill(NaN);
  let filled = 0;
  for (const row of rows) {
    for (let s = 0; s < row.length; s++) {
      if (Number.isNaN(row[s])) {
        if (!Number.isNaN(last[s])) { row[s] = last[s]; filled++; }
      } else last[s] = row[s];
    }
  }
  return filled;
}
