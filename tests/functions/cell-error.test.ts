import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/engine';
import { cellError, guarded } from '../../src/functions/cell-error';
import { customFunctionsApi } from '../../src/functions/runtime-shim';

describe('cellError', () => {
  it('cellError(InputError) is #VALUE! with the message that says what to fix', () => {
    const e = cellError(new InputError('prices has 3 cells', { row: 2 })) as Error & { code: string };
    expect(e).toBeInstanceOf(customFunctionsApi().Error);
    expect(e.code).toBe('#VALUE!');
    expect(e.message).toBe('row 2: prices has 3 cells');
  });

  it('cellError(other error) is #N/A, marked as a fault of ours', () => {
    const e = cellError(new TypeError('x is undefined')) as Error & { code: string };
    expect(e.code).toBe('#N/A');
    expect(e.message).toMatch(/Spotloom could not compute this \(x is undefined\)/);
  });

  it('cellError keeps messages to one line of at most 255 characters', () => {
    const e = cellError(new InputError(`a\n${'b'.repeat(400)}`));
    expect(e.message.length).toBeLessThanOrEqual(255);
    expect(e.message).not.toMatch(/\n/);
  });

  it('guarded(body) passes results through and turns throws into cell errors', async () => {
    await expect(guarded(() => 3)).resolves.toBe(3);
    await expect(guarded(() => { throw new InputError('bad'); })).rejects.toMatchObject({ code: '#VALUE!', message: 'bad' });
  });
});
