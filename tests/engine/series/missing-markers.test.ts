import { describe, expect, it } from 'vitest';
import { isMissingMarker, MISSING_MARKERS } from '../../../src/engine';

// common practice: R writes NA, pandas NaN, SQL exports null, spreadsheets #N/A (#NV in German, from memory)
describe('isMissingMarker(text)', () => {
  it.each([...MISSING_MARKERS, '', '  ', ' na ', 'NULL', 'nan', '#n/a'])('"%s" is a missing marker', (text) => {
    expect(isMissingMarker(text)).toBe(true);
  });

  it.each(['0', '-0', '--', 'N', 'none', 'NaN%', '#VALUE!', '-1', 'n.a.'])('"%s" is not one', (text) => {
    expect(isMissingMarker(text)).toBe(false);
  });
});
