/**
 * A day's slots averaged to hours: 24 values for hourly, half-hourly and
 * quarter-hourly days alike (NaN when any slot of the hour is unknown).
 *
 * @example hourly(Float64Array.from([1, 3, 5, 7, ...]), 2) // [2, 6, ...]
 */
export function hourly(row: Float64Array, slotsPerHour: number): Float64Array {
  if (slotsPerHour === 1) return row;
  const out = new Float64Array(row.length / slotsPerHour);
  for (let h = 0; h < out.length; h++) {
    let sum = 0;
    for (let k = 0; k < slotsPerHour; k++) sum += row[h * slotsPerHour + k];
    out[h] = sum / slotsPerHour;
  }
  return out;
}
