import { describe, expect, it } from 'vitest';
import { loadShape, type DayKind } from '../../../src/engine/demo/load-shape';

const hours = Array.from({ length: 96 }, (_, q) => q / 4);
const profile = (kind: DayKind) => hours.map((h) => loadShape(h, kind));
const argmax = (x: number[], from: number, to: number) => {
  let best = from;
  for (let i = from; i <= to; i++) if (x[i] > x[best]) best = i;
  return best / 4;
};

describe('loadShape(clockHour, kind)', () => {
  it('has a night trough, a morning peak and a higher evening peak on working days (common practice)', () => {
    const w = profile('working');
    const trough = Math.min(...w);
    expect(hours[w.indexOf(trough)]).toBeGreaterThanOrEqual(1);
    expect(hours[w.indexOf(trough)]).toBeLessThanOrEqual(5);
    const morning = argmax(w, 6 * 4, 12 * 4);
    const evening = argmax(w, 16 * 4, 22 * 4);
    expect(morning).toBeGreaterThanOrEqual(8);
    expect(morning).toBeLessThanOrEqual(10.5);
    expect(evening).toBeGreaterThanOrEqual(17.5);
    expect(evening).toBeLessThanOrEqual(19.5);
    // a dip between the peaks
    expect(loadShape(14, 'working')).toBeLessThan(loadShape(morning, 'working'));
    expect(loadShape(evening, 'working')).toBeGreaterThan(loadShape(morning, 'working'));
    expect(trough).toBeLessThan(0.8 * loadShape(evening, 'working'));
  });

  it('orders day kinds by demand during the day: working > bridge > Saturday > Sunday', () => {
    for (let h = 7; h <= 21; h += 0.5) {
      expect(loadShape(h, 'working'), `h ${h}`).toBeGreaterThan(loadShape(h, 'bridge'));
      expect(loadShape(h, 'bridge'), `h ${h}`).toBeGreaterThan(loadShape(h, 'saturday'));
      expect(loadShape(h, 'saturday'), `h ${h}`).toBeGreaterThan(loadShape(h, 'sunday'));
    }
  });

  it('keeps the weekend daily mean within about 25 % of a working day', () => {
    const mean = (k: DayKind) => profile(k).reduce((s, v) => s + v, 0) / hours.length;
    expect(mean('sunday') / mean('working')).toBeGreaterThan(0.75);
    expect(mean('sunday') / mean('working')).toBeLessThan(0.95);
  });
});
