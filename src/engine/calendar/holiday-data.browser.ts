/**
 * The browser build's stand-in for date-holidays' data module
 * (date-holidays/src/data.js, every country's rules, about 800 KB): an empty
 * rule set that holiday-data.ts's prepareHolidays fills one country at a time
 * (webpack.config.js makes the swap).
 */
export const data = { version: 'loaded per country', license: 'CC-BY-SA-3', holidays: {}, names: {} };
