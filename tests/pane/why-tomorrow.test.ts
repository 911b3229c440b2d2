import { beforeAll, describe, expect, it } from 'vitest';
import { parseStoredModel, type StoredModel } from '../../src/engine';
import { barLayout, BAR_ROW } from '../../src/pane/charts/contribution-bars';
import { parseStep, shown, whyBlock, whyTomorrow } from '../../src/pane/logic/why-tomorrow';
import { checkedHistory, trainedText } from './support';

let stored: StoredModel;
beforeAll(async () => { stored = parseStoredModel(await trainedText()); });

describe('whyTomorrow(stored, data, against, step)', () => {
  it('explains tomorrow against D-1; a what-if on the load moves the forecast up (common practice: more load raises the price) and leaves the data as it was', async () => {
    const { data } = await checkedHistory(130);
    const before = JSON.stringify(data.series);
    const why = whyTomorrow(stored, data, 'd-1', { driver: 'load forecast', kind: 'percent', amount: 10 }, true);
    const sum = why.base.contributions.reduce((s, c) => s + c.value, 0);
    expect(Math.abs(sum - why.base.change)).toBeLessThanOrEqual(1e-9 * Math.abs(why.base.change));
    expect(why.whatIf!.explanation.forecastMean).toBeGreaterThan(why.base.forecastMean);
    expect(shown(why)).toBe(why.whatIf!.explanation);
    expect(why.sensitivity!.map((s) => s.driver)).toEqual(['load forecast']);
    expect(JSON.stringify(data.series)).toBe(before);
  });

  it('refuses a what-if on a driver the model does not use', async () => {
    const { data } = await checkedHistory(130);
    expect(() => whyTomorrow(stored, data, 'd-1', { driver: 'wind', kind: 'add', amount: 1 })).toThrow(/does not use the driver "wind"/);
  });
});

describe('parseStep(driver, amount, unit)', () => {
  it('reads "+10", "10 %", "-2,5"; empty or no driver is no step; text is refused', () => {
    expect(parseStep('wind', '+10', 'percent')).toEqual({ driver: 'wind', kind: 'percent', amount: 10 });
    expect(parseStep('wind', '10 %', 'percent')).toEqual({ driver: 'wind', kind: 'percent', amount: 10 });
    expect(parseStep('temp', '-2,5', 'add')).toEqual({ driver: 'temp', kind: 'add', amount: -2.5 });
    expect(parseStep('', '10', 'percent')).toBeUndefined();
    expect(parseStep('wind', ' ', 'percent')).toBeUndefined();
    expect(() => parseStep('wind', 'lots', 'percent')).toThrow(/must be a number/);
  });
});

describe('whyBlock(why, anchor)', () => {
  it('lays out the reference lines, the groups largest first and their sum, two columns from the anchor', async () => {
    const { data } = await checkedHistory(130);
    const why = whyTomorrow(stored, data, 'd-7');
    const block = whyBlock(why, 'Why!B2');
    expect(block.address).toBe(`Why!B2:C${1 + block.values.length}`);
    const head = block.values.findIndex((r) => r[0] === 'input group');
    const groups = block.values.slice(head + 1, head + 1 + why.base.contributions.length);
    expect(groups.map((r) => r[0]).sort()).toEqual(why.base.contributions.map((c) => c.group).sort());
    const last = block.values[head + 1 + groups.length];
    expect(last[0]).toBe('sum (change of the mean)');
    expect(last[1]).toBeCloseTo(why.base.change, 9);
    expect(block.formats[head + 1][1]).toBe('0.00');
  });
});

describe('barLayout(items, width)', () => {
  it('one row per group, largest first; positive bars start at the zero line, negative ones end there, lengths in proportion', () => {
    const { zero, bars } = barLayout([{ group: 'a', value: 1 }, { group: 'b', value: -3 }, { group: 'c', value: 2 }], 400);
    expect(bars.map((b) => b.group)).toEqual(['b', 'c', 'a']);
    expect(bars.map((b) => b.y)).toEqual([8, 8 + BAR_ROW, 8 + 2 * BAR_ROW]);
    expect(bars[0].x + bars[0].width).toBeCloseTo(zero, 12);
    expect(bars[1].x).toBe(zero);
    expect(bars[1].width / bars[2].width).toBeCloseTo(2, 12);
    expect(bars[0].width / bars[2].width).toBeCloseTo(3, 12);
    expect(bars[1].x + bars[1].width).toBeLessThanOrEqual(400);
  });
});
