import { isComplete, type DeliveryDay } from './delivery-days';

/**
 * One column of a series laid out as days × clock slots, so that "the same
 * period of D-7" is a plain row lookup. How daylight-saving days fit the
 * fixed grid (as is usual in the day-ahead literature):
 * - the repeated hour's two values are averaged into their one slot;
 * - the skipped hour's slots, which have no period, are interpolated
 *   linearly between the neighbouring slots of the same day.
 * Unknown values stay NaN; slots outside the data (cut days) stay NaN.
 *
 * @example dayMatrix([1,2,3], [{date, start:0, count:3, expected:3, slots:[0,1,2]}], 3) // [[1,2,3]]
 */
export function dayMatrix(values: ArrayLike<number>, days: DeliveryDay[], slots: number): Float64Array[] {
  return days.map((day) => {
    const sum = new Float64Array(slots);
    const n = new Uint8Array(slots);
    const has = new Uint8Array(slots);
    for (let j = 0; j < day.count; j++) {
      const s = day.slots[j];
      has[s] = 1;
      const v = values[day.start + j];
      if (!Number.isNaN(v)) { sum[s] += v; n[s]++; }
    }
    const row = new Float64Array(slots);
    for (let s = 0; s < slots; s++) row[s] = n[s] ? sum[s] / n[s] : NaN;
    if (isComplete(day) && day.count < slots) fillSkipped(row, has);
    return row;
  });
}

function fillSkipped(row: Float64Array, has: Uint8Array): void {
  for (let s = 0; s < row.length; s++) {
    if (has[s]) continue;
    let a = s - 1;
    while (a >= 0 && !has[a]) a--;
    let b = s + 1;
    while (b < row.length && !has[b]) b++;
    const left = a >= 0 ? row[a] : row[b];
    const right = b < row.length ? row[b] : row[a];
    const w = a >= 0 && b < row.length ? (s - a) / (b - a) : 0;
    row[s] = left + (right - left) * w;
  }
}

/**
 * Spreads a forecast on the day's clock slots back onto its actual periods:
 * both periods of a repeated hour get their slot's value, the skipped hour
 * is simply not there.
 */
export function expandDay(day: DeliveryDay, bySlot: ArrayLike<number>): number[] {
  return day.slots.map((s) => bySlot[s]);
}
