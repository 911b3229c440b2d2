import type { IngestReport, Series } from '../engine';
import type { RangeArgs, SeriesOptions } from './ranges-to-series';

/**
 * The series read from a call's ranges, kept for the next call with the same
 * ranges. A sheet of LOOM cells repeats the same history ranges in every
 * cell; reading them (thousands of timestamps through the zone's clock) costs
 * far more than the forecast itself, and the host hands each call fresh value
 * arrays, so the cache goes by content: a key from a hash of the cells
 * finds the entry, and an exact comparison of every cell confirms it, so an
 * edited cell (or a hash collision) always reads the ranges again.
 *
 * Entries are shared, not copied: callers must not change a cached series
 * (the engine never does: forecastAhead and the baselines build their own
 * frames from it). The few most recent ranges are kept (MAX_ENTRIES).
 * ranges-to-series.ts keeps the timestamps read from a range the same way,
 * so a price edit reads only prices again.
 */
const MAX_ENTRIES = 8;

export interface CachedSeries {
  /** distinct per entry, for caches keyed on the series (next-day.ts) */
  id: number;
  series: Series;
  report: IngestReport;
}

/**
 * A cache of values computed from cells: `get(cells, build)` gives the value
 * built from exactly these cells (compared one by one), building it on a miss.
 * A build that throws stores nothing. Keeps the `max` most recently used.
 */
export class ContentCache<T> {
  private readonly byKey = new Map<string, { cells: unknown[]; id: number; value: T }[]>();
  private order: { key: string; cells: unknown[] }[] = [];
  private static nextId = 1;

  constructor(private readonly max: number) {}

  get(cells: unknown[], build: () => T): { id: number; value: T } {
    const key = fingerprint(cells);
    const bucket = this.byKey.get(key) ?? [];
    const hit = bucket.find((e) => sameCells(e.cells, cells));
    if (hit) {
      this.order = [{ key, cells: hit.cells }, ...this.order.filter((o) => o.cells !== hit.cells)];
      return hit;
    }
    const entry = { cells, id: ContentCache.nextId++, value: build() };
    this.byKey.set(key, [...bucket, entry]);
    this.order = [{ key, cells }, ...this.order];
    for (const old of this.order.splice(this.max)) {
      const rest = (this.byKey.get(old.key) ?? []).filter((e) => e.cells !== old.cells);
      if (rest.length) this.byKey.set(old.key, rest);
      else this.byKey.delete(old.key);
    }
    return entry;
  }

  clear(): void {
    this.byKey.clear();
    this.order = [];
  }
}

const seriesCache = new ContentCache<{ series: Series; report: IngestReport }>(MAX_ENTRIES);

/** The last entry found for a `times` array, with the arrays it came with (the preview hands the same arrays again). */
const byTimesArray = new WeakMap<object, { parts: unknown[]; cells: unknown[]; id: number; value: { series: Series; report: IngestReport } }>();

/**
 * The series of `args` under `options`, from the cache or built by `read`
 * (whose errors pass through). The same range arrays as last time are
 * checked cell by cell against what they held then, without hashing.
 */
export function cachedSeries(args: RangeArgs, options: SeriesOptions, read: () => { series: Series; report: IngestReport }): CachedSeries {
  const parts = [args.times, args.prices, args.driverTimes, args.drivers];
  const anchor = typeof args.times === 'object' && args.times !== null ? args.times : undefined;
  const known = anchor && byTimesArray.get(anchor);
  if (known && known.parts.every((p, i) => p === parts[i]) && sameAsFlattened(args, options, known.cells)) return { id: known.id, ...known.value };
  const cells = flatten(args, options);
  const { id, value } = seriesCache.get(cells, read);
  if (anchor) byTimesArray.set(anchor, { parts, cells, id, value });
  return { id, ...value };
}

/** Whether `args` and `options` hold exactly `cells` (flatten's list), compared without building a new list. */
function sameAsFlattened(args: RangeArgs, options: SeriesOptions, cells: unknown[]): boolean {
  let k = 0;
  const next = (v: unknown) => k < cells.length && Object.is(cells[k++], v);
  if (!next(options.zone) || !next(options.dateSystem ?? '1900') || !next((options.driverNames ?? []).join('\u0000'))) return false;
  for (const range of [args.times, args.prices, args.driverTimes, args.drivers]) {
    if (!next(SEPARATOR)) return false;
    if (!Array.isArray(range)) {
      if (!next(range)) return false;
      continue;
    }
    for (const row of range) {
      if (!next(ROW)) return false;
      if (!Array.isArray(row)) {
        if (!next(row)) return false;
        continue;
      }
      for (const c of row) if (!next(c)) return false;
    }
  }
  return k === cells.length;
}

/** Forgets every entry (tests). */
export function clearRangeCache(): void {
  seriesCache.clear();
}

/** Every cell and option in one list, with markers between the ranges (so cells cannot shift from one range to the next). */
export function flatten(args: RangeArgs, options: SeriesOptions): unknown[] {
  const out: unknown[] = [options.zone, options.dateSystem ?? '1900', (options.driverNames ?? []).join('\u0000')];
  for (const range of [args.times, args.prices, args.driverTimes, args.drivers]) {
    out.push(SEPARATOR);
    if (Array.isArray(range)) {
      for (const row of range) {
        out.push(ROW);
        if (Array.isArray(row)) for (const c of row) out.push(c);
        else out.push(row);
      }
    } else {
      out.push(range);
    }
  }
  return out;
}

const SEPARATOR = Symbol('range');
const ROW = Symbol('row');

function sameCells(a: unknown[], b: unknown[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}

/** FNV-1a over the cells (a number's 64 bits, a text's characters, a tag for the rest), with the count: a key, never the proof. */
const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);

function fingerprint(cells: unknown[]): string {
  let h = 0x811c9dc5;
  const mix = (x: number) => { h = Math.imul(h ^ x, 0x01000193); };
  for (const c of cells) {
    if (typeof c === 'number') {
      bits[0] = c;
      mix(words[0]); mix(words[1]);
    } else if (typeof c === 'string') {
      mix(0x73);
      for (let i = 0; i < c.length; i++) mix(c.charCodeAt(i));
    } else {
      mix(c === ROW ? 0x72 : c === SEPARATOR ? 0x7c : c === null ? 0x6e : c === undefined ? 0x75 : c === true ? 0x74 : c === false ? 0x66 : 0x6f);
    }
  }
  return `${cells.length}:${(h >>> 0).toString(36)}`;
}
