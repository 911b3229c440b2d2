import { describe, expect, it } from 'vitest';
import { parseA1 } from '../../src/host/a1';
import { MemoryWorkbook } from '../../src/host/memory-workbook';
import { writeWithConsent } from '../../src/host/safe-write';
import { BACKTEST_HEADER, FORECAST_HEADER, formulaBlock, valuesBlock, type ForecastRow, type ScoredRow } from '../../src/pane/logic/place-layout';
import { timeCell } from '../../src/pane/logic/number-formats';
import type { DataLayout } from '../../src/pane/logic/read-ranges';

const ZONE = 'Europe/Berlin';
const t0 = Date.parse('2025-06-02T00:00:00+02:00');
const rows: ForecastRow[] = Array.from({ length: 24 }, (_, i) => ({ time: t0 + i * 3_600_000, forecast: 40 + i, lower: i === 3 ? NaN : 30 + i, upper: 50 + i }));
const data: DataLayout = { times: 'History!A2:A900', prices: 'History!B2:B900', drivers: ['History!C2:D900'], driverNames: ['load', 'wind'], rows: 899 };
const backtest: ScoredRow[] = Array.from({ length: 48 }, (_, i) => ({ time: t0 - (48 - i) * 3_600_000, actual: 40 + (i % 5), forecast: 41 + (i % 3), naiveWeek: 39 + (i % 7) }));

describe('valuesBlock(input)', () => {
  it('writes a header and one row per period at the anchor; unknown band values are empty cells', () => {
    const block = valuesBlock({ anchor: 'Forecast!B3', zone: ZONE, dateSystem: '1900', rows });
    expect(block.address).toBe('Forecast!B3:E27');
    expect(block.values[0]).toEqual(FORECAST_HEADER);
    expect(block.values[1]).toEqual([45810, 40, 30, 50]); // 2025-06-02 00:00 is serial 45810 in the 1900 date system
    expect(block.formats[0]).toEqual([null, null, null, null]);
    expect(block.formats[1]).toEqual(['yyyy-mm-dd hh:mm', '0.00', '0.00', '0.00']);
    expect(block.values[4]).toEqual([45810 + 3 / 24, 43, '', 53]);
  });

  it('refuses an empty forecast', () => {
    expect(() => valuesBlock({ anchor: 'A1', zone: ZONE, dateSystem: '1900', rows: [] })).toThrow(/no forecast/);
  });
});

describe('formulaBlock(input)', () => {
  it('puts =LOOM.AHEAD and =LOOM.BAND in the first period row and leaves their spill cells empty', () => {
    const block = formulaBlock({ anchor: 'Forecast!A1', zone: ZONE, dateSystem: '1900', rows, model: 'main', coverage: 0.9, data });
    expect(block.address).toBe('Forecast!A1:D25');
    expect(block.values[1][1]).toBe('=LOOM.AHEAD("main", History!$A$2:$A$900, History!$B$2:$B$900, History!$A$2:$A$900, History!$C$2:$D$900)');
    expect(block.values[1][2]).toBe('=LOOM.BAND("main", History!$A$2:$A$900, History!$B$2:$B$900, History!$A$2:$A$900, History!$C$2:$D$900, 0.9)');
    for (let i = 2; i <= 24; i++) expect(block.values[i].slice(1)).toEqual(['', '', '']);
    expect(block.values.slice(1).map((r) => r[0])).toEqual(rows.map((r) => timeCell(r.time, ZONE, '1900')));
  });

  it('leaves the driver arguments out when the data has no driver range', () => {
    const block = formulaBlock({ anchor: 'A1', zone: ZONE, dateSystem: '1900', rows, model: 'm', coverage: 0.8, data: { ...data, drivers: [], driverNames: [] } });
    expect(block.values[1][1]).toBe('=LOOM.AHEAD("m", History!$A$2:$A$900, History!$B$2:$B$900)');
    expect(block.values[1][2]).toBe('=LOOM.BAND("m", History!$A$2:$A$900, History!$B$2:$B$900, , , 0.8)');
  });

  it('with a backtest: its columns sit right of the block and the =LOOM.SCORE rows read exactly those cells', () => {
    const block = formulaBlock({ anchor: 'Forecast!B2', zone: ZONE, dateSystem: '1900', rows, model: 'main', coverage: 0.9, data, backtest });
    const top = parseA1(block.address);
    expect(top.columns).toBe(FORECAST_HEADER.length + 1 + BACKTEST_HEADER.length);
    expect(top.rows).toBe(Math.max(1 + 24 + 5, 1 + 48));
    const right = FORECAST_HEADER.length + 1;
    expect(block.values[0].slice(right)).toEqual(BACKTEST_HEADER);
    const label = (k: number) => block.values[1 + 24 + 1 + k][0];
    const formula = (k: number) => block.values[1 + 24 + 1 + k][1] as string;
    expect([label(0), label(1), label(2), label(3)]).toEqual(['backtest MAE', 'backtest RMSE', 'backtest sMAPE %', 'backtest rMAE (vs naive-week)']);
    // the block starts at B2, so the backtest columns are G (start), H (actual), I (forecast), J (naive-week), rows 3..50
    expect(formula(0)).toBe('=LOOM.SCORE(Forecast!$H$3:$H$50, Forecast!$I$3:$I$50, "MAE")');
    expect(formula(3)).toBe('=LOOM.SCORE(Forecast!$H$3:$H$50, Forecast!$I$3:$I$50, "RMAE", Forecast!$J$3:$J$50)');
    // the cells those references name hold the backtest's actual and forecast values
    const col = (c: number) => block.values.slice(1, 49).map((r) => r[right + c] as number);
    expect(col(1)).toEqual(backtest.map((r) => r.actual));
    expect(col(2)).toEqual(backtest.map((r) => r.forecast));
  });

  it('refuses drivers split over several ranges, since one formula takes one range', () => {
    expect(() => formulaBlock({ anchor: 'A1', zone: ZONE, dateSystem: '1900', rows, model: 'm', coverage: 0.9, data: { ...data, drivers: ['History!C2:C900', 'Other!A2:A900'] } }))
      .toThrow(/side by side in one range/);
  });

  it('placed through writeWithConsent: asks before overwriting a non-empty cell and writes nothing on no', async () => {
    const port = new MemoryWorkbook({ sheets: { Forecast: [[], [null, null, 'keep me']] } });
    const block = formulaBlock({ anchor: 'Forecast!A1', zone: ZONE, dateSystem: '1900', rows, model: 'main', coverage: 0.9, data });
    const questions: string[] = [];
    const written = await writeWithConsent(port, async (q) => { questions.push(q); return false; }, block.address, block.values);
    expect(written).toBe(false);
    expect(questions).toEqual(['Forecast!A1:D25 already holds 1 non-empty cell. Overwrite it?']);
    expect(await port.readFormulas('Forecast!A1:D3')).toEqual([[null, null, null, null], [null, null, 'keep me', null], [null, null, null, null]]);
    expect(await writeWithConsent(port, async () => true, block.address, block.values)).toBe(true);
    expect((await port.readFormulas('Forecast!B2'))[0][0]).toMatch(/^=LOOM\.AHEAD\(/);
  });
});
