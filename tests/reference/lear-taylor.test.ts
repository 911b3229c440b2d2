import { describe, expect, it } from 'vitest';
import { buildSeries, calibrateLear, DEFAULT_LEAR_SETTINGS, frameBefore, inputFrame, parseCsv, predictLear } from '../../src/engine';
import fx from './fixtures/lear-taylor.json';
import taylor from './fixtures/taylor.json';

// Reference: lear-taylor.json, LEAR written a second time in Python with scikit-learn 1.2.1
// LassoLarsIC(criterion='aic', max_iter=2500) and statsmodels 0.13.5 robust.mad (Debian packages), on
// R forecast 8.20's taylor series (open data: half-hourly demand of England and Wales, 5 June –
// 27 August 2000; taylor.json). Script: make-lars-fixtures.py; calls in README-lars-fixtures.md.

function taylorFrame() {
  const rows = ['timestamp,price'];
  const start = Date.parse('2000-06-04T23:00:00Z'); // local midnight of Monday 5 June 2000, BST
  taylor.values.forEach((v, i) => rows.push(`${new Date(start + i * 1_800_000).toISOString()},${v}`));
  return inputFrame(buildSeries(parseCsv(rows.join('\n'), 'taylor.csv'), { zone: fx.zone }).series);
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('calibrateLear / predictLear on forecast::taylor against scikit-learn', () => {
  const frame = taylorFrame();

  it('lays taylor out as 84 days of 48 half-hours from Monday 5 June 2000', () => {
    expect(frame.days).toHaveLength(84);
    expect(frame.slots).toBe(fx.slots);
    expect(frame.days[0].date).toBe(fx.start);
  });

  it.each(fx.cases.map((c) => [c.level, c.windowDays, c] as const))(
    'reduced set %s (window %d days): chosen alpha, coefficients and forecast of every half-hour',
    (level, windowDays, ref) => {
      const view = frameBefore(frame, ref.targetDay);
      const cal = calibrateLear(view, { ...DEFAULT_LEAR_SETTINGS, windowDays });
      expect(cal.design.level).toBe(level);
      expect(cal.days).toBe(ref.days);
      expect(cal.note).toMatch(/cannot support the published 199 inputs per period/);
      const { point, lower, upper } = predictLear(cal, view);
      expect(view.days[ref.targetDay].date).toBe(ref.targetDate);
      expect(lower).toBeUndefined();
      expect(upper).toBeUndefined();
      ref.periods.forEach((r, h) => {
        const period = cal.periods[h];
        if (r.alpha > 1e-9) expect(rel(period.alpha, r.alpha)).toBeLessThan(1e-8);
        else expect(period.alpha).toBeLessThan(1e-9); // the least-squares end of the path
        expect(period.coef).toHaveLength(r.coef.length);
        r.coef.forEach((b, k) => expect(Math.abs(period.coef[k] - b)).toBeLessThanOrEqual(1e-8 * Math.max(Math.abs(b), 1e-4)));
        expect(rel(point[h], r.forecast)).toBeLessThan(1e-10);
        // epftoolbox refits scikit-learn's coordinate-descent Lasso at the chosen alpha: the same optimum
        if (r.lassoRefitForecast !== null) expect(rel(point[h], r.lassoRefitForecast)).toBeLessThan(1e-7);
        expect(r.warnings).toEqual([]);
      });
    },
  );
});
