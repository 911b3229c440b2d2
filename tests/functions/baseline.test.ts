import { describe, expect, it } from 'vitest';
import { dayStartUtc } from '../../src/engine';
import { baseline } from '../../src/functions/baseline';
import { column, isoTexts, serials } from './synthetic';
import { fixture } from './fixture';

/** Prices of a local day by local hour (the day before a 25-hour day has 24). */
function dayPrices(date: string) {
  const { market } = fixture();
  const i = market.times.indexOf(dayStartUtc(date, market.zone));
  return market.price.slice(i, i + 24);
}

describe('baseline', () => {
  it('baseline(times, prices) is the week-ago price of each local hour, both 02:00 periods of the autumn day included', () => {
    // naive-week: the same clock hour of D-7 (design.md; Nowotarski & Weron 2018); D = 2025-10-26 has 25 periods
    const { market } = fixture();
    const out = baseline(column(serials(market)), column(market.price), null, null).map((r) => r[0]);
    const week = dayPrices('2025-10-19');
    expect(out).toEqual([...week.slice(0, 3), week[2], ...week.slice(3)]);
  });

  it('baseline(..., "day") is the day-before price of each local hour', () => {
    const { market } = fixture();
    const out = baseline(column(isoTexts(market)), column(market.price), 'day', 'Europe/Berlin').map((r) => r[0]);
    const before = dayPrices('2025-10-25');
    expect(out).toEqual([...before.slice(0, 3), before[2], ...before.slice(3)]);
  });

  it('baseline(..., "weekday-rule") looks a week back for a Sunday', () => {
    // 2025-10-26 is a Sunday: the rule takes D-7 on Monday, Saturday and Sunday (Lago et al. 2021)
    const { market } = fixture();
    const t = column(serials(market));
    expect(baseline(t, column(market.price), 'weekday-rule', null)).toEqual(baseline(t, column(market.price), 'week', null));
  });

  it('baseline refuses an unknown kind and timestamps of another zone', () => {
    const { market } = fixture();
    expect(() => baseline(column(serials(market)), column(market.price), 'month', null)).toThrow(/kind "month" is not a baseline/);
    expect(() => baseline(column(isoTexts(market)), column(market.price), 'day', 'Asia/Tokyo')).toThrow(/not a local time of Asia\/Tokyo/);
  });

  it('baseline needs the week before: too short a history is an error, not a guess', () => {
    const { market } = fixture();
    const n = market.times.length;
    const short = { times: column(serials(market)).slice(n - 25 - 72), prices: column(market.price).slice(n - 25 - 72) };
    expect(() => baseline(short.times, short.prices, 'week', null)).toThrow(/needs prices of the week before/);
  });
});
