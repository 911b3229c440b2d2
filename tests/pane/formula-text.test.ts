import { describe, expect, it } from 'vitest';
import { absoluteRef, isLoomFormula, loomCall } from '../../src/pane/logic/formula-text';

describe('absoluteRef(address)', () => {
  it('anchors rows and columns, keeping the sheet (quoted when it needs quotes)', () => {
    expect(absoluteRef('History!A2:A900')).toBe('History!$A$2:$A$900');
    expect(absoluteRef("'Price history'!B2:C9")).toBe("'Price history'!$B$2:$C$9");
    expect(absoluteRef('D4')).toBe('$D$4');
  });
});

describe('loomCall(fn, args)', () => {
  it('quotes texts with doubled inner quotes, anchors references, drops trailing missing arguments', () => {
    expect(loomCall('AHEAD', ['desk "A"', { ref: 'History!A2:A9' }, { ref: 'History!B2:B9' }, undefined, undefined]))
      .toBe('=LOOM.AHEAD("desk ""A""", History!$A$2:$A$9, History!$B$2:$B$9)');
    expect(loomCall('BAND', ['m', { ref: 'A2:A9' }, { ref: 'B2:B9' }, undefined, undefined, 0.9]))
      .toBe('=LOOM.BAND("m", $A$2:$A$9, $B$2:$B$9, , , 0.9)');
  });
});

describe('isLoomFormula(value)', () => {
  it('is true for formulas calling a LOOM function only', () => {
    expect(isLoomFormula('=LOOM.AHEAD("m", A1:A2, B1:B2)')).toBe(true);
    expect(isLoomFormula('=1+loom.score(A1:A2, B1:B2)')).toBe(true);
    expect(isLoomFormula('=SUM(A1:A2)')).toBe(false);
    expect(isLoomFormula('LOOM.AHEAD(')).toBe(false);
    expect(isLoomFormula(42)).toBe(false);
  });
});
