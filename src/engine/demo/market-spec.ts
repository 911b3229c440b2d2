import { IANAZone } from 'luxon';
import { InputError } from '../errors';
import { holidayName } from '../calendar/holidays';
import { dayNumber } from '../calendar/weekday';

/**
 * Optional driver columns a demo market can publish besides
 * `temperature_forecast` and `load_forecast` (all are day-ahead forecasts).
 */
export type ExtraDriver = 'solar_forecast' | 'wind_forecast';

/**
 * Everything that defines an invented demo market. All names and numbers
 * describe an imagined scenario, not a real market.
 */
export interface MarketSpec {
  /** invented name of the market zone */
  name: string;
  /** invented trading company whose desk uses the data */
  company: string;
  /** one line for people: what this scenario is */
  description: string;
  /** IANA time zone of the market; delivery days are local calendar days there */
  zone: string;
  /** public-holiday region the zone observes (date-holidays code, e.g. DE, AU-SA) */
  region: string;
  /** first and last delivery day, `YYYY-MM-DD`, both included */
  start: string;
  end: string;
  /** delivery period in minutes */
  resolution: 15 | 30 | 60;
  /** where the sun is reckoned from (degrees north / east) */
  latitude: number;
  longitude: number;
  currency: string;
  /** published after temperature_forecast and load_forecast, in this order */
  extraDrivers: readonly ExtraDriver[];
  climate: {
    /** yearly mean temperature °C */
    meanC: number;
    /** half the summer–winter swing of daily means, °C */
    seasonC: number;
    /** day of the year (1–365) with the warmest mean */
    warmestDay: number;
    /** swing between night minimum and afternoon maximum, °C */
    dayNightC: number;
    /** standard deviation of day-to-day weather anomalies, °C */
    anomalyC: number;
    /** standard deviation of the day-ahead temperature forecast error, °C */
    forecastErrorC: number;
    /** day-to-day persistence of cloudiness, 0 (none) … below 1 (long sunny or dull spells) */
    cloudPersistence: number;
  };
  load: {
    /** load of a mild working day at the midday plateau, MW */
    baseMW: number;
    /** extra MW per °C below `heatingBelowC` */
    heatingMWPerC: number;
    heatingBelowC: number;
    /** extra MW per °C above `coolingAboveC` (mostly in the afternoon) */
    coolingMWPerC: number;
    coolingAboveC: number;
    /** standard deviation of the day-ahead load forecast error, share of load */
    forecastError: number;
  };
  supply: {
    /** dispatchable (thermal, hydro, imports) capacity, MW */
    capacityMW: number;
    /** installed wind, MW */
    windMW: number;
    /** installed solar, MW */
    solarMW: number;
  };
  fuel: {
    /** mid-merit marginal cost on the first day, currency/MWh */
    start: number;
    /** drift of the long-run level, share per year (0.05 = +5 %/year) */
    trendPerYear: number;
    /** daily pull back towards the long-run level (0.02 = 2 % of the gap per day) */
    reversionPerDay: number;
    /** daily volatility of the log cost */
    volatilityPerDay: number;
    /** a lasting jump of the cost: from `from` it ramps linearly over `days` to `factor` times the path */
    shock?: { from: string; days: number; factor: number };
  };
  /** expected number of unforeseeable price spikes (plant trips) per year */
  spikesPerYear: number;
}

/**
 * Checks a market spec before generation.
 *
 * @param spec - the market to check
 * @throws InputError naming the first field that is out of range
 * @example checkMarketSpec(DEMO_MARKET) // passes silently
 */
export function checkMarketSpec(spec: MarketSpec): void {
  const fail = (what: string): never => {
    throw new InputError(`demo market "${spec.name}": ${what}`);
  };
  if (!IANAZone.isValidZone(spec.zone)) fail(`zone "${spec.zone}" is not an IANA time zone such as Europe/Berlin`);
  holidayName(spec.start, spec.region); // throws a clear message for an unknown region or date
  if (dayNumber(spec.end) < dayNumber(spec.start)) fail(`end ${spec.end} lies before start ${spec.start}`);
  if (![15, 30, 60].includes(spec.resolution)) fail(`resolution ${spec.resolution} must be 15, 30 or 60 minutes`);
  const positive: [string, number][] = [
    ['load.baseMW', spec.load.baseMW],
    ['supply.capacityMW', spec.supply.capacityMW],
    ['fuel.start', spec.fuel.start],
  ];
  for (const [field, v] of positive) if (!(v > 0)) fail(`${field} must be a positive number, got ${v}`);
  const nonNegative: [string, number][] = [
    ['supply.windMW', spec.supply.windMW],
    ['supply.solarMW', spec.supply.solarMW],
    ['load.heatingMWPerC', spec.load.heatingMWPerC],
    ['load.coolingMWPerC', spec.load.coolingMWPerC],
    ['load.forecastError', spec.load.forecastError],
    ['climate.anomalyC', spec.climate.anomalyC],
    ['climate.forecastErrorC', spec.climate.forecastErrorC],
    ['fuel.volatilityPerDay', spec.fuel.volatilityPerDay],
    ['spikesPerYear', spec.spikesPerYear],
  ];
  for (const [field, v] of nonNegative) if (!(v >= 0)) fail(`${field} must be zero or more, got ${v}`);
  if (!(spec.climate.cloudPersistence >= 0 && spec.climate.cloudPersistence < 1)) {
    fail(`climate.cloudPersistence must lie in [0, 1), got ${spec.climate.cloudPersistence}`);
  }
  if (!(spec.fuel.reversionPerDay >= 0 && spec.fuel.reversionPerDay < 1)) {
    fail(`fuel.reversionPerDay must lie in [0, 1), got ${spec.fuel.reversionPerDay}`);
  }
  const shock = spec.fuel.shock;
  if (shock) {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(shock.from)) fail(`fuel.shock.from must be a date YYYY-MM-DD, got ${shock.from}`);
    if (!(Number.isInteger(shock.days) && shock.days >= 1)) fail(`fuel.shock.days must be a whole number of days, 1 or more, got ${shock.days}`);
    if (!(shock.factor > 0)) fail(`fuel.shock.factor must be a positive number, got ${shock.factor}`);
  }
  if (!(Math.abs(spec.latitude) <= 90 && Math.abs(spec.longitude) <= 180)) fail('latitude/longitude out of range');
  if (new Set(spec.extraDrivers).size !== spec.extraDrivers.length) fail('extraDrivers lists a column twice');
}
