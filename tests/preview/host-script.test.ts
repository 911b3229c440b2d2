import { describe, expect, it } from 'vitest';
import { completeCustomFunctions, quietHostTelemetry } from '../../src/preview/host-script';

describe('completeCustomFunctions(scope)', () => {
  it('adds Error and ErrorCode to the bare CustomFunctions that office.js leaves outside the host', () => {
    const scope: { CustomFunctions?: { associate?: () => void; Error?: unknown; ErrorCode?: unknown } } = { CustomFunctions: { associate: () => undefined } };
    completeCustomFunctions(scope);
    const api = scope.CustomFunctions as { Error: new (code: string, message?: string) => Error & { code: string }; ErrorCode: Record<string, string> };
    const err = new api.Error(api.ErrorCode.invalidValue, 'what to fix');
    expect([err.code, err.message, err instanceof Error]).toEqual(['#VALUE!', 'what to fix', true]);
    expect(api.ErrorCode.notAvailable).toBe('#N/A');
  });

  it('leaves a complete runtime, and a page without one, as they are', () => {
    const own = class extends Error {};
    const scope = { CustomFunctions: { Error: own, ErrorCode: { invalidValue: 'X' } } };
    completeCustomFunctions(scope);
    expect(scope.CustomFunctions.Error).toBe(own);
    const none: { CustomFunctions?: { Error?: unknown } } = {};
    completeCustomFunctions(none);
    expect(none.CustomFunctions).toBeUndefined();
  });
});

describe('quietHostTelemetry(scope)', () => {
  it('switches off the telemetry logger\'s frame loader and log writer once the host script made it', async () => {
    let framed = 0, logged = 0;
    const scope: { OSF?: { Logger?: { ulsEndpoint?: { loadProxyFrame?: () => void; writeLog?: (t: string) => void } } } } = {};
    const stop = quietHostTelemetry(scope, 2000);
    await new Promise((r) => setTimeout(r, 60));
    scope.OSF = { Logger: { ulsEndpoint: { loadProxyFrame: () => { framed++; }, writeLog: () => { logged++; } } } };
    await new Promise((r) => setTimeout(r, 120));
    scope.OSF.Logger!.ulsEndpoint!.loadProxyFrame!();
    scope.OSF.Logger!.ulsEndpoint!.writeLog!('x');
    expect([framed, logged]).toEqual([0, 0]);
    stop();
  });
});
