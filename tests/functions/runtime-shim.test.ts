import { describe, expect, it } from 'vitest';
import { associatedFunctions, customFunctionsApi } from '../../src/functions/runtime-shim';

describe('runtime-shim', () => {
  it('puts a stand-in CustomFunctions on the global when the host has none', () => {
    const api = (globalThis as { CustomFunctions?: unknown }).CustomFunctions;
    expect(api).toBe(customFunctionsApi());
    expect(customFunctionsApi().ErrorCode.invalidValue).toBe('#VALUE!');
  });

  it('the stand-in records associations by upper-case id', () => {
    const f = () => 1;
    customFunctionsApi().associate('probe', f);
    expect(associatedFunctions().get('PROBE')).toBe(f);
  });

  it('the stand-in Error carries the code', () => {
    const api = customFunctionsApi();
    const e = new api.Error(api.ErrorCode.notAvailable, 'why');
    expect(e).toMatchObject({ code: '#N/A', message: 'why' });
  });
});
