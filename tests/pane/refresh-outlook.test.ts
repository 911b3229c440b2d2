import { describe, expect, it } from 'vitest';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { ARCHIVE_SHEET } from '../../src/pane/logic/archive';
import { OUTLOOK_SHEET, type OutlookInput } from '../../src/pane/logic/outlook-layout';
import { refreshOutlook } from '../../src/pane/logic/refresh-outlook';

const t0 = Date.parse('2025-06-02T00:00:00+02:00');
const input = (issuedAt: number): OutlookInput => ({
  model: 'main', coverage: 0.9, issuedAt, zone: 'Europe/Berlin', dateSystem: '1900',
  rows: Array.from({ length: 24 }, (_, i) => ({ time: t0 + i * 3_600_000, forecast: 40 + i, lower: 35 + i, upper: 45 + i })),
  data: { times: 'History!A2:A900', prices: 'History!B2:B900', drivers: [], driverNames: [], rows: 899 },
  scores: [],
});
const issue = { model: 'main', created: '2025-06-01T08:00:00.000Z', version: '1-00000000' };

describe('refreshOutlook(port, ask, input, issue)', () => {
  it('first refresh: builds the sheet, its chart and the archive without asking (nothing to overwrite)', async () => {
    const port = new MemoryWorkbook();
    let asked = 0;
    const archived = await refreshOutlook(port, async () => { asked++; return true; }, input(t0 - 10 * 3_600_000), issue);
    expect(asked).toBe(0);
    expect(archived).toBe("'Forecast archive'!A1:H25");
    expect(port.charts).toEqual([{ sheet: OUTLOOK_SHEET, address: 'A12:F36', title: 'Tomorrow: forecast, band and baselines' }]);
    expect((await port.readFormulas('Outlook!B13'))[0][0]).toMatch(/^=LOOM\.AHEAD\("main"/);
  });

  it('a second refresh asks before overwriting; on no, nothing is written, charted or archived', async () => {
    const port = new MemoryWorkbook();
    await refreshOutlook(port, async () => true, input(t0 - 10 * 3_600_000), issue);
    const outlook = port.usedGrid(OUTLOOK_SHEET), archive = port.usedGrid(ARCHIVE_SHEET);
    const questions: string[] = [];
    expect(await refreshOutlook(port, async (q) => { questions.push(q); return false; }, input(t0 - 5 * 3_600_000), issue)).toBeUndefined();
    expect(questions).toEqual([expect.stringMatching(/^Outlook!A1:G112 already holds \d+ non-empty cells\. Overwrite them\?$/)]);
    expect(port.usedGrid(OUTLOOK_SHEET)).toEqual(outlook);
    expect(port.usedGrid(ARCHIVE_SHEET)).toEqual(archive);
    expect(port.charts.length).toBe(1);
  });

  it('on yes, the new issue is appended below the earlier one', async () => {
    const port = new MemoryWorkbook();
    await refreshOutlook(port, async () => true, input(t0 - 10 * 3_600_000), issue);
    expect(await refreshOutlook(port, async () => true, input(t0 - 5 * 3_600_000), issue)).toBe("'Forecast archive'!A26:H49");
    const archive = port.usedGrid(ARCHIVE_SHEET);
    expect(archive[1][0]).toBe('2025-06-01T14:00:00+02:00');
    expect(archive[25][0]).toBe('2025-06-01T19:00:00+02:00');
  });
});
