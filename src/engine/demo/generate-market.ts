import seedrandom from 'seedrandom';
import { InputError } from '../errors';
import { isBridgeDay } from '../calendar/bridge-days';
import { holidayName } from '../calendar/holidays';
import { dayNumber, isoWeekday } from '../calendar/weekday';
import { dayPeriods } from './day-periods';
import { gaussianSource } from './gaussian';
import { localTimestamp } from './local-timestamp';
import { loadShape, type DayKind } from './load-shape';
import { checkMarketSpec, type ExtraDriver, type MarketSpec } from './market-spec';
import { meritOrderPrice } from './merit-order';
import { solarShare } from './solar-share';

/**
 * One delivery period of an invented demo market: its start (ISO 8601 with
 * the local UTC offset), the day-ahead price and the driver forecasts that
 * were known before the auction. Values are rounded as the CSV writes them:
 * price to cents, temperature to 0.1 °C, load, solar and wind to whole MW.
 */
export interface DemoRow {
  timestamp: string;
  price: number;
  temperature_forecast: number;
  load_forecast: number;
  solar_forecast?: number;
  wind_forecast?: number;
}

const TAU = 2 * Math.PI;
/** day-to-day persistence (AR(1) coefficient) of the day-level price shock */
const SHOCK_PERSISTENCE = 0.55;
const SHOCK_SD = 0.06;
/** draws per period behind the floor's median */
const FLOOR_DRAWS = 201;
/** day-to-day persistence of the wind regime */
const WIND_PERSISTENCE = 0.65;

/**
 * Generates an invented market whose prices behave like day-ahead prices.
 *
 * What drives the price (all invented, stylised; common practice for
 * synthetic electricity-market data):
 * - weather: seasonal temperature, a day-night swing and persistent weather
 *   anomalies (AR(1) from day to day); the published temperature forecast is
 *   the actual temperature plus a small daily and hourly error;
 * - demand: a daily profile with morning and evening peaks on working days,
 *   lower Saturdays, lowest Sundays and public holidays (of `spec.region`,
 *   via holidayName), in-between bridge days and 24 December – 2 January; heating
 *   demand in the cold, cooling demand in the heat; the published load
 *   forecast is the true load plus a daily and hourly error;
 * - wind (persistent regimes) and solar (sun height × cloudiness) lower the
 *   residual load; they are published only when listed in `extraDrivers`;
 * - a fuel cost that drifts (log random walk with a trend and mean reversion)
 *   scales the whole curve;
 * - a convex merit-order curve turns residual load into price: steep at high
 *   load, near or below zero when wind and solar cover most of the load;
 * - unforeseeable parts: plant outages lasting days, short price spikes, a
 *   day-level price shock with day-to-day persistence and period noise.
 *
 * @param spec - the market (e.g. DEMO_MARKET, SOLAR_MARKET)
 * @param seed - any finite number; the same seed gives the same rows
 * @returns rows in delivery-period order, from local midnight of `spec.start` to the end of `spec.end`
 * @throws InputError when the spec is out of range or the seed is not a finite number
 * @example generateMarket(DEMO_MARKET, 1)[0].timestamp // '2024-06-01T00:00:00+02:00'
 */
export function generateMarket(spec: MarketSpec, seed: number): DemoRow[] {
  return generate(spec, seed, false).rows;
}

/**
 * The market of generateMarket together with, per row, the generator's own
 * floor: the median price over 201 draws of everything a forecaster cannot
 * know the day before (the load's, wind's and solar's deviation from their
 * published forecasts, or where they are not published the next day's wind
 * regime and this day's cloudiness given the day before; the day's fuel
 * move, price shock and period noise), with the day-level states of the day
 * before (fuel cost, outages, shock, cloudiness, and the wind regime this
 * day starts from, which the day before's last hours show) at their true
 * values, which no forecaster sees exactly. The median minimises the
 * expected absolute error, so a model's MAE over the floor's shows how much
 * is left to learn; the floor errs on the generous side (it knows the day
 * before exactly; spikes and new outages are left out, a few per cent of
 * days). Its draws come from a random source of their own, so the rows
 * equal generateMarket's.
 */
export function generateMarketWithOracle(spec: MarketSpec, seed: number): { rows: DemoRow[]; oracle: number[] } {
  return generate(spec, seed, true);
}

function generate(spec: MarketSpec, seed: number, withFloor: boolean): { rows: DemoRow[]; oracle: number[] } {
  if (!Number.isFinite(seed)) throw new InputError(`demo seed must be a finite number, got ${seed}`);
  checkMarketSpec(spec);
  const random = seedrandom.alea(`spotloom-demo:${seed}`);
  const normal = gaussianSource(random);
  const days = dayNumber(spec.end) - dayNumber(spec.start) + 1;
  const { climate, load, supply, fuel } = spec;

  // ---- day-level states (one extra day so intraday values can glide into the next day)
  const n = days + 1;
  const tempAnomaly = ar1(n, 0.5, climate.anomalyC, normal);
  const windRegime = ar1(n, WIND_PERSISTENCE, 1, normal);
  const cloud = ar1(n, climate.cloudPersistence, 1, normal);
  const priceShock = ar1(n, SHOCK_PERSISTENCE, SHOCK_SD, normal);
  const loadShock = ar1(n, 0.2, 0.05, normal);
  const tempError = Array.from({ length: n }, () => climate.forecastErrorC * normal());
  const loadError = Array.from({ length: n }, () => load.forecastError * normal());
  const solarError = Array.from({ length: n }, () => 0.07 * normal());
  const windError = Array.from({ length: n }, () => 0.1 * normal());
  const fuelCost = fuelPath(n, spec, normal);
  const outage = outages(n, random);
  const spikes = Array.from({ length: n }, () =>
    random() < spec.spikesPerYear / 365
      ? { from: 7 + 13 * random(), hours: 1 + 3 * random(), size: 0.4 + 1.6 * random() ** 2 }
      : undefined,
  );

  const step = spec.resolution / 60; // hours per period
  const hourlyPhi = (phi: number) => phi ** step;
  let tempNoise = 0;
  let loadNoise = 0;
  let priceNoise = 0;
  const rows: DemoRow[] = [];
  const oracle: number[] = [];
  const published = (name: ExtraDriver) => spec.extraDrivers.includes(name);
  // the floor's own random source, so the rows stay those of generateMarket
  const floorNormal = gaussianSource(seedrandom.alea(`spotloom-floor:${seed}`));
  const draws = new Float64Array(FLOOR_DRAWS);
  const loadErrorSd = Math.hypot(load.forecastError, 0.006);
  const windInnovation = Math.sqrt(1 - WIND_PERSISTENCE ** 2);
  const cloudInnovation = Math.sqrt(1 - climate.cloudPersistence ** 2);
  const shockInnovation = SHOCK_SD * Math.sqrt(1 - SHOCK_PERSISTENCE ** 2);

  const calendar = dayPeriods(spec.start, spec.end, spec.zone, spec.resolution);
  for (let d = 0; d < days; d++) {
    const periods = calendar[d];
    const date = periods.date;
    const kind = dayKind(date, spec.region);
    const count = periods.start.length;
    const season = Math.cos((TAU * (dayOfYear(date) - climate.warmestDay)) / 365.25);
    const winter = -season; // +1 on the coldest day of the year: windier
    const clearnessOf = (c: number) => 0.4 + 0.6 / (1 + Math.exp(-(1.2 * c + 0.9 + 0.4 * season)));
    const clearness = clearnessOf(cloud[d]);
    const capacity = supply.capacityMW * (1 - outage[d]);
    // the floor's view: the day-level states of the day before
    const prior = Math.max(0, d - 1);
    const knownCapacity = supply.capacityMW * (1 - outage[prior]);
    const spike = spikes[d];

    for (let k = 0; k < count; k++) {
      const t = periods.start[k];
      const h = periods.clock[k] / 60;
      const f = k / count; // share of the day gone: glide day-level states into the next day

      // weather
      tempNoise = hourlyPhi(0.9) * tempNoise + 0.35 * Math.sqrt(1 - hourlyPhi(0.9) ** 2) * normal();
      const anomaly = (1 - f) * tempAnomaly[d] + f * tempAnomaly[d + 1];
      const temperature =
        climate.meanC + climate.seasonC * season + anomaly + (climate.dayNightC / 2) * Math.cos((TAU * (h - 15)) / 24) + tempNoise;
      const temperatureForecast = temperature + (1 - f) * tempError[d] + f * tempError[d + 1] + 0.3 * normal();

      // demand
      loadNoise = hourlyPhi(0.8) * loadNoise + 0.006 * Math.sqrt(1 - hourlyPhi(0.8) ** 2) * normal();
      const heating = load.heatingMWPerC * Math.max(0, load.heatingBelowC - temperature);
      const cooling = load.coolingMWPerC * Math.max(0, temperature - load.coolingAboveC) * (0.6 + 0.4 * bump(h, 16, 4));
      const trueLoad = (load.baseMW * loadShape(h, kind) + heating + cooling) * (1 + loadShock[d] + loadNoise);
      const loadForecast = trueLoad * (1 + (1 - f) * loadError[d] + f * loadError[d + 1] + 0.006 * normal());

      // wind and solar
      const regime = (1 - f) * windRegime[d] + f * windRegime[d + 1];
      const windShareOf = (r: number) => 1 / (1 + Math.exp(-(1.3 * r - 1.1 + 0.35 * winter + 0.15 * Math.cos((TAU * (h - 3)) / 24))));
      const windShare = windShareOf(regime);
      const wind = supply.windMW * windShare;
      const windForecast = supply.windMW * clamp01(windShare * (1 + windError[d]) + 0.02 * normal());
      const sun = solarShare(t + (spec.resolution * 60_000) / 2, spec.latitude, spec.longitude);
      const solar = supply.solarMW * sun * clamp01(clearness * (1 + 0.06 * normal()));
      const solarForecast = supply.solarMW * sun * clamp01(clearness * (1 + solarError[d]) + 0.02 * normal());

      // price
      priceNoise = hourlyPhi(0.8) * priceNoise + Math.sqrt(1 - hourlyPhi(0.8) ** 2) * normal();
      const share = (trueLoad - wind - solar) / capacity;
      let price = meritOrderPrice(share, fuelCost[d]) * Math.exp(priceShock[d]);
      price += priceNoise * (1.5 + 0.035 * Math.abs(price));
      if (spike && h >= spike.from && h < spike.from + spike.hours) price += spike.size * (Math.abs(price) + fuelCost[d]);

      // the floor: the median of the price over draws of everything unknown the day before
      for (let j = 0; withFloor && j < FLOOR_DRAWS; j++) {
        const z = floorNormal;
        const trueLoadGuess = loadForecast / (1 + loadErrorSd * z());
        let windGuess: number, solarGuess: number;
        if (published('wind_forecast')) windGuess = Math.max(0, windForecast / (1 + 0.1 * z()));
        else {
          // the regime glides from day to day, so the last hours of the day before already show this day's regime
          const rd = windRegime[d];
          windGuess = supply.windMW * windShareOf((1 - f) * rd + f * (WIND_PERSISTENCE * rd + windInnovation * z()));
        }
        if (published('solar_forecast')) solarGuess = Math.max(0, solarForecast / (1 + 0.07 * z()));
        else solarGuess = supply.solarMW * sun * clamp01(clearnessOf(climate.cloudPersistence * cloud[prior] + cloudInnovation * z()) * (1 + 0.06 * z()));
        const guessShare = (trueLoadGuess - windGuess - solarGuess) / knownCapacity;
        const shock = SHOCK_PERSISTENCE * priceShock[prior] + shockInnovation * z();
        let p = meritOrderPrice(guessShare, fuelCost[prior] * Math.exp(spec.fuel.volatilityPerDay * z())) * Math.exp(shock);
        p += z() * (1.5 + 0.035 * Math.abs(p));
        draws[j] = p;
      }
      if (withFloor) oracle.push(round(draws.sort()[FLOOR_DRAWS >> 1], 2));

      const row: DemoRow = {
        timestamp: localTimestamp(date, periods.clock[k], periods.offset[k]),
        price: round(price, 2),
        temperature_forecast: round(temperatureForecast, 1),
        load_forecast: Math.round(loadForecast),
      };
      for (const extra of spec.extraDrivers) {
        row[extra] = Math.round(extra === 'solar_forecast' ? solarForecast : windForecast);
      }
      rows.push(row);
    }
  }
  return { rows, oracle };
}

function dayKind(date: string, region: string): DayKind {
  const weekday = isoWeekday(date);
  if (weekday === 7 || holidayName(date, region) !== '') return 'sunday';
  if (weekday === 6) return 'saturday';
  const md = date.slice(5);
  if (md >= '12-24' || md <= '01-02' || isBridgeDay(date, region)) return 'bridge';
  return 'working';
}

/** AR(1) path with stationary standard deviation `sd`. */
function ar1(n: number, phi: number, sd: number, normal: () => number): number[] {
  const out = new Array<number>(n);
  let x = sd * normal();
  const innovation = sd * Math.sqrt(1 - phi * phi);
  for (let i = 0; i < n; i++) {
    out[i] = x;
    x = phi * x + innovation * normal();
  }
  return out;
}

/** Daily fuel cost: log random walk pulled towards a trending long-run level, times an optional shock. */
function fuelPath(n: number, spec: MarketSpec, normal: () => number): number[] {
  const { start, trendPerYear, reversionPerDay, volatilityPerDay, shock } = spec.fuel;
  const out = new Array<number>(n);
  let x = Math.log(start);
  const shockFrom = shock ? dayNumber(shock.from) - dayNumber(spec.start) : Infinity;
  for (let i = 0; i < n; i++) {
    // a shock (a fuel-supply crisis) lifts the cost by `factor`, ramping in linearly over its days
    const lift = shock ? 1 + (shock.factor - 1) * Math.min(1, Math.max(0, (i - shockFrom + 1) / shock.days)) : 1;
    out[i] = Math.exp(x) * lift;
    const level = Math.log(start) + (Math.log(1 + trendPerYear) * (i + 1)) / 365;
    x += Math.log(1 + trendPerYear) / 365 + reversionPerDay * (level - x) + volatilityPerDay * normal();
  }
  return out;
}

/** Share of dispatchable capacity out of service each day: a few outages a year, 1–6 days each. */
function outages(n: number, random: () => number): number[] {
  const out = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    if (random() < 8 / 365) {
      const size = 0.04 + 0.1 * random();
      const length = 1 + Math.floor(6 * random());
      for (let j = i; j < Math.min(n, i + length); j++) out[j] += size;
    }
  }
  return out;
}

function dayOfYear(date: string): number {
  return dayNumber(date) - dayNumber(`${date.slice(0, 4)}-01-01`) + 1;
}

function bump(h: number, centre: number, width: number): number {
  return Math.exp(-0.5 * ((h - centre) / width) ** 2);
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  const r = Math.round(x * f) / f;
  return r === 0 ? 0 : r; // no -0
}
