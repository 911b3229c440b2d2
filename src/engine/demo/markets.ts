import type { MarketSpec } from './market-spec';

/**
 * The invented demo scenario (hourly). The market zone "Brindlemoor" and the
 * trading company "Quillfeather Energy Trading" are made up. The zone keeps
 * central-European clocks (Europe/Berlin, EU summer time) and observes the
 * nationwide public holidays of region DE (date-holidays data). About two and
 * a half years of hourly delivery periods, ending 30 November 2026; published
 * drivers are the day-ahead temperature and load forecasts. Wind and solar
 * output exist in the scenario but are not published, so part of the price
 * moves can only be read from recent prices.
 */
export const DEMO_MARKET: MarketSpec = {
  name: 'Brindlemoor',
  company: 'Quillfeather Energy Trading',
  description:
    'invented hourly market zone Brindlemoor, traded by the invented Quillfeather Energy Trading desk; Europe/Berlin clocks, DE public holidays',
  zone: 'Europe/Berlin',
  region: 'DE',
  start: '2024-06-01',
  end: '2026-11-30',
  resolution: 60,
  latitude: 52,
  longitude: 11,
  currency: 'EUR',
  extraDrivers: [],
  climate: { meanC: 10, seasonC: 9.5, warmestDay: 200, dayNightC: 8, anomalyC: 4, forecastErrorC: 0.9, cloudPersistence: 0.75 },
  load: {
    baseMW: 6000,
    heatingMWPerC: 130,
    heatingBelowC: 14,
    coolingMWPerC: 90,
    coolingAboveC: 22,
    forecastError: 0.015,
  },
  supply: { capacityMW: 9800, windMW: 1600, solarMW: 4200 },
  fuel: { start: 78, trendPerYear: 0.03, reversionPerDay: 0.01, volatilityPerDay: 0.018 },
  spikesPerYear: 14,
};

/**
 * The invented solar-heavy scenario (quarter-hourly). The market zone
 * "Saltbush Reach" and the company "Emberlyn Power Partners" are made up.
 * The zone keeps South Australian clocks (Australia/Adelaide: UTC+9:30,
 * summer time UTC+10:30 from the first Sunday of October to the first Sunday
 * of April) and observes the public holidays of region AU-SA (date-holidays
 * data; part-day holidays left out). Much rooftop and utility solar makes
 * midday prices dip, below zero on sunny mild weekends. About one and a half
 * years of 15-minute periods, ending 30 November 2026; published drivers are
 * temperature, load and solar forecasts.
 */
export const SOLAR_MARKET: MarketSpec = {
  name: 'Saltbush Reach',
  company: 'Emberlyn Power Partners',
  description:
    'invented quarter-hourly, solar-heavy market zone Saltbush Reach, traded by the invented Emberlyn Power Partners; Australia/Adelaide clocks, AU-SA public holidays',
  zone: 'Australia/Adelaide',
  region: 'AU-SA',
  start: '2025-06-01',
  end: '2026-11-30',
  resolution: 15,
  latitude: -34.9,
  longitude: 138.6,
  currency: 'AUD',
  extraDrivers: ['solar_forecast'],
  climate: { meanC: 17, seasonC: 6, warmestDay: 25, dayNightC: 10, anomalyC: 3, forecastErrorC: 1.0, cloudPersistence: 0.4 },
  load: {
    baseMW: 1700,
    heatingMWPerC: 22,
    heatingBelowC: 13,
    coolingMWPerC: 70,
    coolingAboveC: 23,
    forecastError: 0.02,
  },
  supply: { capacityMW: 2500, windMW: 500, solarMW: 1500 },
  fuel: { start: 95, trendPerYear: 0.02, reversionPerDay: 0.012, volatilityPerDay: 0.02 },
  spikesPerYear: 12,
};

/**
 * The invented level-shift scenario (half-hourly). The market zone
 * "Cindervale" and the company "Marrowby Grid Traders" are made up. The zone
 * keeps British clocks (Europe/London) and observes the public holidays of
 * region GB-ENG (date-holidays data). One year of 30-minute periods ending
 * 30 November 2026, so about nine months of history before a 91-day test;
 * published drivers are temperature, load and wind forecasts. From
 * 18 August 2026 the fuel cost doubles over four weeks (an invented supply
 * crisis), so the price level doubles around the start of the test.
 */
export const SHIFT_MARKET: MarketSpec = {
  name: 'Cindervale',
  company: 'Marrowby Grid Traders',
  description:
    'invented half-hourly, windy market zone Cindervale, traded by the invented Marrowby Grid Traders; Europe/London clocks, GB-ENG public holidays; its fuel cost doubles from 18 August 2026',
  zone: 'Europe/London',
  region: 'GB-ENG',
  start: '2025-12-01',
  end: '2026-11-30',
  resolution: 30,
  latitude: 53.5,
  longitude: -1.5,
  currency: 'GBP',
  extraDrivers: ['wind_forecast'],
  climate: { meanC: 10, seasonC: 6.5, warmestDay: 205, dayNightC: 7, anomalyC: 3, forecastErrorC: 0.9, cloudPersistence: 0.6 },
  load: {
    baseMW: 4200,
    heatingMWPerC: 110,
    heatingBelowC: 15,
    coolingMWPerC: 20,
    coolingAboveC: 25,
    forecastError: 0.015,
  },
  supply: { capacityMW: 6200, windMW: 2600, solarMW: 600 },
  fuel: { start: 70, trendPerYear: 0.02, reversionPerDay: 0.01, volatilityPerDay: 0.018, shock: { from: '2026-08-18', days: 28, factor: 2 } },
  spikesPerYear: 10,
};
