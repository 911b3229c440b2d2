/**
 * Series layout (read this first).
 *
 * A `Series` is columns of aligned values, one entry per delivery period:
 *
 *   times[i]    UTC instant (ms since 1970) at which period i starts
 *   price[i]    its price in currency/MWh, NaN when unknown (may be negative)
 *   drivers[k]  the same layout for each known-ahead driver column k
 *
 * Periods are sorted, strictly equally spaced by `resolution` minutes, with no
 * duplicates. A missing row in the source becomes a period whose values are
 * NaN, so a gap is always visible, never silently closed. `zone` is the IANA
 * time zone of the market: a delivery day is a local calendar day there.
 */
export type Resolution = 15 | 30 | 60;

export interface Series {
  times: number[];
  price: number[];
  drivers: Record<string, number[]>;
  resolution: Resolution;
  zone: string;
}

/** Names of the driver columns, in a stable order. */
export function driverNames(series: Series): string[] {
  return Object.keys(series.drivers);
}
