import { describe, expect, it } from 'vitest';
import { DEMO_MARKET, generateMarket } from '../../src/engine';
import { parseA1 } from '../../src/host/a1';
import { DEMO_DAYS, demoWorkbook, MIN_DAYS, SCORE_DAYS } from '../../src/preview/demo-workbook';

const rows = generateMarket(DEMO_MARKET, 1);
const demo = demoWorkbook({ rows });

describe('demoWorkbook()', () => {
  it('History holds the last DEMO_DAYS days of the invented market as generated, then the next day with drivers and no price', () => {
    const history = demo.sheets.History;
    expect(history[0]).toEqual(['timestamp', 'price', 'temperature_forecast', 'load_forecast']);
    const last = rows[rows.length - 1];
    expect(history[history.length - 1]).toEqual([last.timestamp, null, last.temperature_forecast, last.load_forecast]);
    expect(demo.tomorrow).toBe(last.timestamp.slice(0, 10));
    const dates = new Set(history.slice(1).map((r) => String(r[0]).slice(0, 10)));
    expect(dates.size).toBe(DEMO_DAYS + 1);
    const priced = history.slice(1).filter((r) => r[1] !== null);
    expect(priced.every((r) => !String(r[0]).startsWith(demo.tomorrow))).toBe(true);
    const k = rows.findIndex((r) => r.timestamp === history[1][0]);
    expect(history[1]).toEqual([rows[k].timestamp, rows[k].price, rows[k].temperature_forecast, rows[k].load_forecast]);
    expect(demo.rows).toEqual({ first: 2, lastPrice: 1 + priced.length, last: history.length });
  });

  it('the Data ranges and the Drivers sheet cover exactly those rows', () => {
    expect(demo.ranges).toEqual({ times: `History!A1:A${demo.rows.last}`, prices: `History!B1:B${demo.rows.last}`, drivers: [`History!C1:D${demo.rows.last}`] });
    const tomorrowRows = demo.sheets.History.filter((r) => String(r[0]).startsWith(demo.tomorrow));
    expect(demo.sheets.Drivers.slice(1).map((r) => r.slice(0, 3))).toEqual(tomorrowRows.map((r) => [r[0], r[2], r[3]]));
  });

  it('the scored window is the last SCORE_DAYS days with prices, against the same hours a day and a week before', () => {
    const h = demo.sheets.History;
    const [a, d, w] = [demo.scored.actual, demo.scored.naiveDay, demo.scored.naiveWeek].map((x) => parseA1(x));
    expect(a.row + a.rows).toBe(demo.rows.lastPrice);
    expect(a.rows).toBe(24 * SCORE_DAYS);
    for (let i = 0; i < a.rows; i += 37) {
      const now = String(h[a.row + i][0]), day = String(h[d.row + i][0]), week = String(h[w.row + i][0]);
      expect(day.slice(11, 16)).toBe(now.slice(11, 16));
      expect(week.slice(11, 16)).toBe(now.slice(11, 16));
      expect(Date.parse(now) - Date.parse(week)).toBe(7 * 86_400_000);
    }
  });

  it('every showcase cell on Outlook holds a LOOM formula (or a plain reference) the preview can read', () => {
    const grid = demo.sheets.Outlook;
    const called = new Set<string>();
    for (const address of Object.values(demo.showcase)) {
      const r = parseA1(address);
      const formula = String(grid[r.row][r.column]);
      const call = /^=LOOM\.([A-Z]+)\(/.exec(formula);
      if (call) called.add(call[1]);
      else expect(formula).toMatch(/^=([A-Za-z]+!)?\$?[A-Z]+\$?\d+$/);
    }
    expect([...called].sort()).toEqual(['AHEAD', 'BAND', 'BASELINE', 'COMPARE', 'HOLIDAY', 'MODEL', 'SCORE']);
  });

  it('a shorter history keeps the same last day; one too short for the scored window is refused', () => {
    const short = demoWorkbook({ rows, days: MIN_DAYS });
    expect(short.tomorrow).toBe(demo.tomorrow);
    expect(new Set(short.sheets.History.slice(1).map((r) => String(r[0]).slice(0, 10))).size).toBe(MIN_DAYS + 1);
    expect(() => demoWorkbook({ rows, days: MIN_DAYS - 1 })).toThrow(/needs at least 36 days/);
  });
});
