import { afterEach, describe, expect, it } from 'vitest';
import { cachedSeries, clearRangeCache, ContentCache } from '../../src/functions/range-cache';
import { seriesFromRanges } from '../../src/functions/ranges-to-series';

/**
 * The content caches of the cell functions: a hit only for exactly the same
 * cells, whatever the arrays; any changed cell reads the ranges again (the
 * expected series are seriesFromRanges' own, read without the cache).
 */
const times = () => [['2025-03-01T00:00:00+01:00'], ['2025-03-01T01:00:00+01:00'], ['2025-03-01T02:00:00+01:00']];
const prices = () => [[40], [41.5], [39]];
const options = { zone: 'Europe/Berlin' };

afterEach(() => clearRangeCache());

describe('cachedSeries(args, options, read)', () => {
  it('reads once for the same cells in fresh arrays (the host hands new arrays each call)', () => {
    let reads = 0;
    const read = (args: { times: unknown; prices: unknown }) => () => { reads++; return seriesFromRanges(args, options); };
    const a = { times: times(), prices: prices() };
    const first = cachedSeries(a, options, read(a));
    const b = { times: times(), prices: prices() };
    const second = cachedSeries(b, options, read(b));
    expect(reads).toBe(1);
    expect(second.id).toBe(first.id);
    expect(second.series).toEqual(seriesFromRanges(b, options).series);
  });

  it('reads again when one price changes, also in the same arrays changed in place', () => {
    let reads = 0;
    const args = { times: times(), prices: prices() };
    const read = () => { reads++; return seriesFromRanges(args, options); };
    const first = cachedSeries(args, options, read);
    args.prices[1][0] = 45;
    const changed = cachedSeries(args, options, read);
    expect(reads).toBe(2);
    expect(changed.id).not.toBe(first.id);
    expect(changed.series.price[1]).toBe(45);
  });

  it('tells apart a number from its text, an empty cell from 0, other zones and other driver names', () => {
    let reads = 0;
    const read = () => { reads++; return seriesFromRanges({ times: times(), prices: prices() }, options); };
    cachedSeries({ times: times(), prices: prices() }, options, read);
    cachedSeries({ times: times(), prices: [['40'], [41.5], [39]] }, options, read);
    cachedSeries({ times: times(), prices: [[null], [41.5], [39]] }, options, read);
    cachedSeries({ times: times(), prices: [[0], [41.5], [39]] }, options, read);
    cachedSeries({ times: times(), prices: prices() }, { zone: 'Europe/Paris' }, read);
    cachedSeries({ times: times(), prices: prices() }, { zone: 'Europe/Berlin', driverNames: ['load'] }, read);
    // cells moved from one range to the next are other ranges
    cachedSeries({ times: times(), prices: prices(), drivers: [[1]] }, options, read);
    cachedSeries({ times: times(), prices: prices(), driverTimes: [[1]] }, options, read);
    expect(reads).toBe(8);
  });

  it('passes errors through and keeps nothing for them', () => {
    const bad = { times: [['not a time']], prices: [[1]] };
    const read = () => seriesFromRanges(bad, options);
    expect(() => cachedSeries(bad, options, read)).toThrow(/times/);
    expect(() => cachedSeries(bad, options, read)).toThrow(/times/);
  });
});

describe('ContentCache(max)', () => {
  it('keeps the max most recently used entries', () => {
    const cache = new ContentCache<number>(2);
    let builds = 0;
    const get = (cells: unknown[]) => cache.get(cells, () => ++builds).value;
    get([1]); get([2]); get([1]); get([3]); // [2] is the least recently used and goes
    expect(builds).toBe(3);
    get([1]); get([3]);
    expect(builds).toBe(3);
    get([2]);
    expect(builds).toBe(4);
  });
});
