import { afterEach, describe, expect, it, vi } from 'vitest';

const scope = globalThis as { Office?: unknown };
afterEach(() => { delete scope.Office; vi.resetModules(); });

describe('startHost', () => {
  it('startHost() inside the spreadsheet host binds the Office workbook for the functions and the pane', async () => {
    scope.Office = { onReady: async () => ({ host: 'Excel', platform: 'PC' }) };
    const { startHost } = await import('../../src/host/start-host');
    const { currentModelStore } = await import('../../src/host/model-store');
    const started = await startHost();
    expect(started.info.inHost).toBe(true);
    expect(started.port?.kind).toBe('office');
    expect(currentModelStore()).toBe(started.store);
    expect(await startHost()).toBe(started); // once per page
  });

  it('startHost() outside the host binds nothing (the preview binds its own workbook)', async () => {
    const { startHost } = await import('../../src/host/start-host');
    const { currentModelStore } = await import('../../src/host/model-store');
    const started = await startHost();
    expect(started).toEqual({ info: { inHost: false, host: null, platform: null } });
    expect(currentModelStore()).toBeUndefined();
  });
});
