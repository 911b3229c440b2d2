import { describe, expect, it, vi } from 'vitest';
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

  it('completes a bare CustomFunctions global (office.js outside a host leaves only associate)', async () => {
    vi.resetModules();
    const scope = globalThis as { CustomFunctions?: unknown };
    const before = scope.CustomFunctions;
    const associate = () => {};
    scope.CustomFunctions = { associate };
    try {
      const { customFunctionsApi } = await import('../../src/functions/runtime-shim');
      const api = customFunctionsApi();
      expect(api.associate).toBe(associate);
      const e = new api.Error(api.ErrorCode.invalidValue, 'fix this');
      expect(e).toBeInstanceOf(api.Error);
      expect(e.code).toBe('#VALUE!');
    } finally {
      scope.CustomFunctions = before;
      vi.resetModules();
    }
  });
});
