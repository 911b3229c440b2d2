import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/preview/formula-parse';

describe('parseFormula(formula)', () => {
  it('reads a LOOM call with absolute references, text and numbers, as the pane writes them', () => {
    const node = parseFormula('=LOOM.BAND("main", History!$A$2:$A$900, History!$B$2:$B$900, , History!$C$2:$D$900, 0.9)');
    expect(node.kind).toBe('call');
    if (node.kind !== 'call') return;
    expect(node.name).toBe('BAND');
    expect(node.args.map((a) => a?.kind ?? null)).toEqual(['text', 'ref', 'ref', null, 'ref', 'number']);
    const times = node.args[1];
    expect(times?.kind === 'ref' && times.range).toEqual({ sheet: 'History', row: 1, column: 0, rows: 899, columns: 1 });
    const drivers = node.args[4];
    expect(drivers?.kind === 'ref' && [drivers.range.columns, drivers.range.rows]).toEqual([2, 899]);
  });

  it('reads names without regard to case, quoted sheet names, doubled quotes in text and a leading minus', () => {
    const node = parseFormula("=loom.score('Forecast archive'!F2:F9, 'It''s'!G2:G9, \"say \"\"MAE\"\"\", -3)");
    expect(node.kind === 'call' && node.name).toBe('SCORE');
    if (node.kind !== 'call') return;
    expect(node.args[0]?.kind === 'ref' && node.args[0].range.sheet).toBe('Forecast archive');
    expect(node.args[1]?.kind === 'ref' && node.args[1].range.sheet).toBe("It's");
    expect(node.args[2]).toEqual({ kind: 'text', value: 'say "MAE"' });
    expect(node.args[3]).toEqual({ kind: 'number', value: -3 });
  });

  it('reads a plain reference, a range, a boolean and an empty call', () => {
    expect(parseFormula('=A1')).toMatchObject({ kind: 'ref', range: { row: 0, column: 0, rows: 1, columns: 1 } });
    expect(parseFormula('= History!B5:C6 ')).toMatchObject({ kind: 'ref', range: { sheet: 'History', row: 4, column: 1, rows: 2, columns: 2 } });
    expect(parseFormula('=TRUE')).toEqual({ kind: 'bool', value: true });
    expect(parseFormula('=LOOM.MODEL()')).toEqual({ kind: 'call', name: 'MODEL', args: [] });
    expect(parseFormula('=-A1')).toMatchObject({ kind: 'neg', arg: { kind: 'ref' } });
  });

  it('refuses other functions, arithmetic and broken text with a message naming what it knows', () => {
    expect(() => parseFormula('=SUM(A1:A3)')).toThrow(/only LOOM functions and references, not SUM/);
    expect(() => parseFormula('=A1+A2')).toThrow(/unexpected text at "\+A2"/);
    expect(() => parseFormula('=LOOM.SCORE("MAE')).toThrow(/missing closing "/);
    expect(() => parseFormula('=LOOM.SCORE(A1 A2)')).toThrow(/expected , or \)/);
    expect(() => parseFormula('=foo')).toThrow(/unknown name "foo"/);
    expect(() => parseFormula('A1')).toThrow(/starts with =/);
  });
});
