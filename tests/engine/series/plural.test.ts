import { describe, expect, it } from 'vitest';
import { plural } from '../../../src/engine';

describe('plural(n, noun)', () => {
  it('writes 1 row, 0 rows, 2 rows', () => {
    expect(plural(1, 'row')).toBe('1 row');
    expect(plural(0, 'row')).toBe('0 rows');
    expect(plural(2, 'delivery day')).toBe('2 delivery days');
  });
});
