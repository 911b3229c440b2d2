/**
 * Public holidays of a region, answered from the `date-holidays` package
 * (https://github.com/commenthol/date-holidays, data under CC-BY-3.0).
 *
 * Region codes are ISO 3166 style: a country (`DE`, `FR`), optionally a state
 * (`DE-BY`, `US-CA`, `AU-SA`) and, where the package knows one, a region
 * below it (`US-LA-NO`). Letter case does not matter.
 *
 * Rules kept here:
 * - only holidays of type `public` count (not bank, school, optional or
 *   observance days);
 * - a holiday counts only when it lasts (nearly) the whole day, at least 20
 *   hours; part-day holidays (e.g. South Australia's Christmas Eve from 19:00)
 *   are left out, because the delivery day is mostly an ordinary day;
 * - answers do not depend on the time zone the process runs in;
 * - a holiday lasting several days counts on each of them;
 * - two holidays on one date give both names joined by " / ";
 * - names are in the package's default language for the country.
 *
 * Answers are cached per region and year (one `Map` of date → name), so a
 * call for every day of several years costs one lookup per day.
 *
 * In the add-in's browser build a country's rules load on demand: an adapter
 * awaits `prepareHolidays(region)` (holiday-data.ts) before the first call for
 * that region; in Node they are all there.
 */
import type Holidays from 'date-holidays';
import { InputError } from '../errors';
import { holidaysPending } from './holiday-data';
import { holidaysClass } from './holiday-parser';
import { dayNumber, dateOfDayNumber } from './weekday';

export { prepareHolidays } from './holiday-data';

/** A holiday shorter than this is a part day and does not count (a 23-hour clock-change day does). */
const MIN_HOURS = 20;

interface YearCache {
  /** public holidays only, date → name */
  holidays: Map<string, string>;
  /** every date asked so far (checked real), date → name or '' */
  answers: Map<string, string>;
}

interface RegionCache {
  source: Holidays;
  years: Map<number, YearCache>;
}

const regions = new Map<string, RegionCache>();
let directory: Holidays | undefined;

/**
 * Name of the public holiday on a local calendar date in a region.
 *
 * @param date - local calendar date `YYYY-MM-DD`
 * @param region - `CC`, `CC-STATE` or `CC-STATE-REGION`, e.g. `DE`, `DE-BY`, `US-CA`
 * @returns the holiday name, or `''` when the date is not a public holiday
 * @throws InputError when `date` is not a real date or `region` is unknown
 * @example holidayName('2025-10-03', 'DE') // 'Tag der Deutschen Einheit'
 * @see https://github.com/commenthol/date-holidays (holiday rules and names)
 */
export function holidayName(date: string, region: string): string {
  // Only checked dates are ever stored, so a hit needs no further check; a miss
  // goes through dayNumber, which throws the one clear message for a bad date.
  const year = typeof date === 'string' ? Number(date.slice(0, 4)) : NaN;
  const cache = Number.isInteger(year) ? yearCache(regionCache(region), year) : undefined;
  const known = cache?.answers.get(date);
  if (known !== undefined) return known;
  dayNumber(date); // a real date always has a whole year, so `cache` is set below
  const name = cache!.holidays.get(date) ?? '';
  cache!.answers.set(date, name);
  return name;
}

/**
 * All public holidays of one year in a region, as date → name.
 *
 * @param year - calendar year, e.g. 2025
 * @param region - as for {@link holidayName}
 * @returns a read-only map from `YYYY-MM-DD` to holiday name, in date order
 * @throws InputError when `region` is unknown or `year` is not a whole number
 * @example holidaysOfYear(2025, 'FR').get('2025-07-14') // 'Fête Nationale de la France'
 */
export function holidaysOfYear(year: number, region: string): ReadonlyMap<string, string> {
  if (!Number.isInteger(year)) throw new InputError(`holidaysOfYear needs a whole year, got ${year}`);
  return yearCache(regionCache(region), year).holidays;
}

function yearCache(cache: RegionCache, year: number): YearCache {
  let hit = cache.years.get(year);
  if (!hit) {
    hit = { holidays: yearNames(cache.source, year), answers: new Map() };
    cache.years.set(year, hit);
  }
  return hit;
}

function yearNames(source: Holidays, year: number): Map<string, string> {
  const names = new Map<string, string>();
  for (const h of source.getHolidays(year)) {
    if (h.type !== 'public') continue;
    // Judge part days by length, not by the start time in `h.date`: that wall-clock
    // time follows the process's zone and reads 01:00 where local midnight is skipped
    // by a clock change (Brazil before 2019).
    const hours = (h.end.getTime() - h.start.getTime()) / 3_600_000;
    if (hours < MIN_HOURS) continue;
    const first = dayNumber(h.date.slice(0, 10));
    const days = Math.max(1, Math.round(hours / 24));
    for (let k = 0; k < days; k++) {
      const d = dateOfDayNumber(first + k);
      if (Number(d.slice(0, 4)) !== year) continue;
      const before = names.get(d);
      if (before === undefined) names.set(d, h.name);
      else if (!before.split(' / ').includes(h.name)) names.set(d, `${before} / ${h.name}`);
    }
  }
  return new Map([...names].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
}

function regionCache(region: string): RegionCache {
  const hit = regions.get(region);
  if (hit) return hit;
  const parts = canonicalRegion(region);
  const source = new (parserClass())({ types: ['public'] });
  source.init(parts[0], parts[1], parts[2]);
  const cache: RegionCache = { source, years: new Map() };
  regions.set(region, cache);
  return cache;
}

/** Splits and checks a region code against the package's lists; returns canonical parts. */
function canonicalRegion(region: string): [string, string?, string?] {
  const bad = (why: string): never => {
    throw new InputError(
      `holiday region "${region}" ${why}; use a country code like DE or FR, optionally with a state, e.g. DE-BY or US-CA`,
    );
  };
  if (typeof region !== 'string' || region.trim() === '') bad('is empty');
  const parts = region.trim().split('-');
  if (parts.length > 3 || parts.some((p) => p === '')) bad('is not of the form CC, CC-STATE or CC-STATE-REGION');
  if (holidaysPending(parts[0])) notLoaded(parts[0]);
  directory ??= new (parserClass())();
  const country = pick(directory.getCountries('en'), parts[0]) ?? bad(`names no country the holiday data knows`);
  if (parts.length === 1) return [country];
  const state =
    pick(directory.getStates(country, 'en') ?? {}, parts[1]) ?? bad(`names no state of ${country} the holiday data knows`);
  if (parts.length === 2) return [country, state];
  const sub =
    pick(directory.getRegions(country, state, 'en') ?? {}, parts[2]) ??
    bad(`names no region of ${country}-${state} the holiday data knows`);
  return [country, state, sub];
}

function parserClass(): NonNullable<ReturnType<typeof holidaysClass>> {
  return holidaysClass() ?? notLoaded('any region');
}

function notLoaded(what: string): never {
  throw new Error(`the holiday rules of ${what.toUpperCase()} were used before they were loaded (prepareHolidays); please report it`);
}

function pick(codes: Record<string, string>, wanted: string): string | undefined {
  const w = wanted.toUpperCase();
  return Object.keys(codes).find((code) => code.toUpperCase() === w);
}
