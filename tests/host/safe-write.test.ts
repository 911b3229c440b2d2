import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { writeWithConsent } from '../../src/host/safe-write';

function asker(answer: boolean) {
  const questions: string[] = [];
  return { questions, ask: async (q: string) => { questions.push(q); return answer; } };
}

describe('writeWithConsent', () => {
  it('writes into empty cells without asking, sized by the values', async () => {
    const wb = new MemoryWorkbook({ sheets: { Out: [] } });
    const { questions, ask } = asker(false);
    expect(await writeWithConsent(wb, ask, 'Out!B2', [[1, 2], [3, 4]])).toBe(true);
    expect(questions).toEqual([]);
    expect(await wb.readRange('Out!B2:C3')).toEqual([[1, 2], [3, 4]]);
  });

  it('asks before overwriting non-empty cells, counting them', async () => {
    const wb = new MemoryWorkbook({ sheets: { Out: [[null, null], [null, 'keep']] } });
    const { questions, ask } = asker(true);
    await writeWithConsent(wb, ask, 'Out!A1', [[1, 2], [3, 4]]);
    expect(questions).toEqual(['Out!A1:B2 already holds 1 non-empty cell. Overwrite it?']);
    expect(await wb.readRange('Out!A1:B2')).toEqual([[1, 2], [3, 4]]);
  });

  it('writes nothing at all when the answer is no', async () => {
    const wb = new MemoryWorkbook({ sheets: { Out: [['a', null], [null, '=LOOM.AHEAD("m",A:A,B:B)']] } });
    const { questions, ask } = asker(false);
    expect(await writeWithConsent(wb, ask, 'Out!A1', [[1, 2], [3, 4]])).toBe(false);
    expect(questions[0]).toMatch(/2 non-empty cells/);
    expect(await wb.readFormulas('Out!A1:B2')).toEqual([['a', null], [null, '=LOOM.AHEAD("m",A:A,B:B)']]);
  });

  it('counts a formula cell as non-empty even when its value is empty', async () => {
    const wb = new MemoryWorkbook({ sheets: { Out: [['=NA()']] } });
    const { questions, ask } = asker(false);
    await writeWithConsent(wb, ask, 'Out!A1', [[5]]);
    expect(questions).toHaveLength(1);
  });
});
