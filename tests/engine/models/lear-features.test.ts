import { describe, expect, it } from 'vitest';
import { addDays, type DayFrame } from '../../../src/engine';
import { inputValue, LEAR_LEVELS, learDesign, publishedInputCount, widestPeriod } from '../../../src/engine/models/lear-features';

// The published layout: Lago, Marcjasz, De Schutter & Weron (2021), Applied Energy 293, 116983, §5.1
// (from memory): 96 price inputs (24 hours of D-1, D-2, D-3, D-7), 72 per exogenous series (D, D-1,
// D-7) and 7 weekday dummies, i.e. 247 with the paper's two exogenous series.
describe('learDesign(level, slots, drivers)', () => {
  it('published, hourly, two drivers: the same 247 inputs for every hour', () => {
    const d = learDesign('published', 24, ['load', 'wind']);
    expect(d.inputs).toHaveLength(247);
    expect(publishedInputCount(24, 2)).toBe(247);
    expect(d.byPeriod).toHaveLength(24);
    for (const list of d.byPeriod) expect(list).toEqual(d.byPeriod[0]);
    expect(d.maxLag).toBe(7);
    const keys = d.inputs.map((x) => x.key);
    expect(keys).toContain('price D-7 23-24');
    expect(keys).toContain('wind D-0 0-1');
    expect(keys).not.toContain('wind D-2 0-1');
    expect(keys.filter((k) => k.startsWith('weekday'))).toEqual([1, 2, 3, 4, 5, 6, 7].map((w) => `weekday ${w}`));
  });

  it.each([[24, 0], [48, 1], [96, 3]])('publishedInputCount(%i, %i) is the size of the published set', (slots, k) => {
    const drivers = ['a', 'b', 'c'].slice(0, k);
    expect(learDesign('published', slots, drivers).byPeriod[0].length).toBe(publishedInputCount(slots, k));
  });

  it('hourly-profile at quarter-hours: 24 hourly means of each lag plus the period\'s own slot', () => {
    const d = learDesign('hourly-profile', 96, ['load']);
    expect(widestPeriod(d)).toBe(4 * 25 + 3 * 25 + 7);
    const keys = (h: number) => d.byPeriod[h].map((i) => d.inputs[i].key);
    expect(keys(0)).toContain('price D-1 0-4'); // hour 0 = slots 0..3
    expect(keys(0)).toContain('price D-1 0-1'); // own slot
    expect(keys(37)).toContain('load D-7 37-38');
    expect(keys(37)).not.toContain('load D-7 0-1');
    // shared inputs appear once in the union
    expect(d.inputs).toHaveLength(4 * 24 + 4 * 96 + 3 * 24 + 3 * 96 + 7);
  });

  it('keeps an input once where an hourly mean is the slot itself (hourly data)', () => {
    const d = learDesign('recent-profile', 24, ['load']);
    // 24 hours of D-1 (own slot among them) + own slot of D-2, D-3, D-7; 24 hours of D + own of D-1, D-7; 7 dummies
    expect(widestPeriod(d)).toBe(24 + 3 + 24 + 2 + 7);
    for (const list of d.byPeriod) expect(new Set(list).size).toBe(list.length);
  });

  it('shrinks from level to level and drops D-7 and the dummies in the shortest sets', () => {
    const sizes = LEAR_LEVELS.map((level) => widestPeriod(learDesign(level, 96, ['t', 'l', 's'])));
    expect(sizes).toEqual([...sizes].sort((a, b) => b - a));
    expect(learDesign('own-period-short', 96, ['t']).maxLag).toBe(3);
    expect(learDesign('minimal', 96, ['t']).maxLag).toBe(2);
    expect(learDesign('minimal', 24, ['t']).inputs.map((x) => x.key).filter((k) => k.startsWith('weekday'))).toEqual([]);
    // own-period: own slot of D-1, D-2, D-3, D-7, the last hour of D-1, the driver at D, D-1, D-7, 7 dummies
    expect(widestPeriod(learDesign('own-period', 96, ['t']))).toBe(4 + 1 + 3 + 7);
  });
});

// The reduced levels, input by input, as the table in lear-features.ts states them
// (our own reductions of the published set above); quarter-hours, so that the last hour
// of D-1 (slots 92-95) and the hourly means (4 slots each) differ from single slots.
describe('learDesign at quarter-hours, period 37 (hour 9)', () => {
  const keys = (level: Parameters<typeof learDesign>[0]) => {
    const d = learDesign(level, 96, ['load']);
    return d.byPeriod[37].map((i) => d.inputs[i].key);
  };
  const dummies = [1, 2, 3, 4, 5, 6, 7].map((w) => `weekday ${w}`);

  it('own-period: own slot of D-1, D-2, D-3, D-7, last hour of D-1, own slot of the driver at D, D-1, D-7, 7 dummies', () => {
    expect(keys('own-period')).toEqual([
      'price D-1 37-38', 'price D-2 37-38', 'price D-3 37-38', 'price D-7 37-38', 'price D-1 92-96',
      'load D-0 37-38', 'load D-1 37-38', 'load D-7 37-38', ...dummies,
    ]);
  });

  it('own-period-short and minimal', () => {
    expect(keys('own-period-short')).toEqual([
      'price D-1 37-38', 'price D-2 37-38', 'price D-3 37-38', 'price D-1 92-96', 'load D-0 37-38', 'load D-1 37-38',
    ]);
    expect(keys('minimal')).toEqual(['price D-1 37-38', 'price D-2 37-38', 'price D-1 92-96', 'load D-0 37-38']);
  });

  it('recent-profile: the 24 hourly means of D-1 cover slots 4j to 4j + 4', () => {
    const k = keys('recent-profile');
    expect(k.slice(0, 24)).toEqual(Array.from({ length: 24 }, (_, j) => `price D-1 ${4 * j}-${4 * j + 4}`));
    expect(k).toContain('price D-7 37-38');
  });

  it('every input reads the source its key names; the dummies read the weekday', () => {
    for (const level of LEAR_LEVELS) {
      for (const x of learDesign(level, 96, ['load']).inputs) {
        expect(x.source).toBe(x.weekday ? 'weekday' : x.key.split(' ')[0]);
      }
    }
  });
});

describe('inputValue(view, input, t, weekdayOf)', () => {
  const slots = 4;
  const frame: DayFrame = {
    zone: 'UTC', resolution: 60, slots,
    days: Array.from({ length: 4 }, (_, i) => ({ date: addDays('2025-03-03', i), start: i * slots, count: slots, expected: slots, slots: [0, 1, 2, 3] })),
    price: [[1, 2, 3, 4], [5, 6, 7, 8], [9, 10, 11, 12]].map((r) => Float64Array.from(r)),
    drivers: { load: [[0, 0, 0, 0], [1, 1, 1, 1], [2, 2, 2, 2], [3, 4, 5, 6]].map((r) => Float64Array.from(r)) },
  };
  const weekdayOf = (t: number) => t + 1; // 2025-03-03 is a Monday

  it('averages the slots of the lag day and reads drivers of the day itself', () => {
    expect(inputValue(frame, { key: '', source: 'price', lag: 1, from: 2, to: 4 }, 3, weekdayOf)).toBe(11.5);
    expect(inputValue(frame, { key: '', source: 'load', lag: 0, from: 0, to: 4 }, 3, weekdayOf)).toBe(4.5);
    expect(inputValue(frame, { key: '', source: 'weekday', lag: 0, from: 0, to: 0, weekday: 4 }, 3, weekdayOf)).toBe(1);
    expect(inputValue(frame, { key: '', source: 'weekday', lag: 0, from: 0, to: 0, weekday: 1 }, 3, weekdayOf)).toBe(0);
  });

  it('is NaN where the row is not in the view (before the data, or a price of the target day)', () => {
    expect(inputValue(frame, { key: '', source: 'price', lag: 7, from: 0, to: 1 }, 3, weekdayOf)).toBeNaN();
    expect(inputValue(frame, { key: '', source: 'price', lag: 0, from: 0, to: 1 }, 3, weekdayOf)).toBeNaN();
    expect(inputValue(frame, { key: '', source: 'wind', lag: 0, from: 0, to: 1 }, 3, weekdayOf)).toBeNaN();
  });
});
