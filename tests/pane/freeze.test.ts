import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { freezeRange, freezeValues } from '../../src/pane/logic/freeze';

describe('freezeValues(formulas, values)', () => {
  it('replaces LOOM formulas by their values, keeps other formulas, writes spilled cells as their values', () => {
    const formulas = [['=LOOM.AHEAD("m", A1:A9, B1:B9)', '=SUM(C1:C2)'], [41.5, 'label'], [null, null]];
    const values = [[40.25, 7], [41.5, 'label'], [null, null]];
    expect(freezeValues(formulas, values)).toEqual({ values: [[40.25, '=SUM(C1:C2)'], [41.5, 'label'], [null, null]], frozen: 1 });
  });
});

describe('freezeRange(port, ask, address)', () => {
  const workbook = () => new MemoryWorkbook({
    sheets: { Outlook: [['delivery start', 'forecast'], ['2025-06-02T00:00:00+02:00', '=LOOM.AHEAD("main", H!A2:A9, H!B2:B9)'], [null, '=SUM(B2:B2)']] },
    // a stand-in evaluator: every formula shows 42
    evaluate: () => 42,
  });

  it('asks first and changes nothing when the answer is no', async () => {
    const port = workbook();
    const before = port.usedGrid('Outlook');
    const questions: string[] = [];
    const n = await freezeRange(port, async (q) => { questions.push(q); return false; }, 'Outlook!A1:B3');
    expect(n).toBe(0);
    expect(questions.length).toBe(1);
    expect(questions[0]).toMatch(/^Replace the 1 LOOM formula in Outlook!A1:B3 by its current values\?/);
    expect(port.usedGrid('Outlook')).toEqual(before);
  });

  it('on yes writes the values in place of the LOOM formulas only', async () => {
    const port = workbook();
    expect(await freezeRange(port, async () => true, 'Outlook!A1:B3')).toBe(1);
    expect(await port.readFormulas('Outlook!B2:B3')).toEqual([[42], ['=SUM(B2:B2)']]);
  });

  it('asks nothing and writes nothing when there is no LOOM formula', async () => {
    const port = new MemoryWorkbook({ sheets: { Outlook: [['a', 1]] } });
    let asked = false;
    expect(await freezeRange(port, async () => { asked = true; return true; }, 'Outlook!A1:B1')).toBe(0);
    expect(asked).toBe(false);
  });
});
