import { afterEach, describe, expect, it, vi } from 'vitest';
import { InputError } from '../../src/engine';
import { detectHost, hostErrorMessage, isSpreadsheetHost, logHostError } from '../../src/host/host-detect';

const scope = globalThis as { Office?: unknown };
afterEach(() => { delete scope.Office; vi.restoreAllMocks(); });

describe('detectHost', () => {
  it('detectHost() without the host\'s script on the page is outside the host', async () => {
    expect(await detectHost()).toEqual({ inHost: false, host: null, platform: null });
  });

  it('detectHost() names host and platform with the helpers\' constants when Office.onReady says so', async () => {
    scope.Office = { onReady: async () => ({ host: 'Excel', platform: 'OfficeOnline' }) };
    const info = await detectHost();
    expect(info).toEqual({ inHost: true, host: 'EXCEL', platform: 'OFFICE_ONLINE' });
    expect(isSpreadsheetHost(info)).toBe(true);
  });

  it('detectHost() is outside the host when the script is there but no host answers', async () => {
    scope.Office = { onReady: () => new Promise(() => {}) };
    expect(await detectHost(20)).toEqual({ inHost: false, host: null, platform: null });
    scope.Office = { onReady: async () => ({ host: null, platform: null }) };
    expect((await detectHost()).inHost).toBe(false);
  });

  it('isSpreadsheetHost is false for another application', () => {
    expect(isSpreadsheetHost({ inHost: true, host: 'WORD', platform: 'PC' })).toBe(false);
  });
});

describe('host errors', () => {
  it('hostErrorMessage gives one line, with the host\'s error code', () => {
    expect(hostErrorMessage(new InputError('prices has 3 cells', { row: 2 }))).toBe('row 2: prices has 3 cells');
    expect(hostErrorMessage(Object.assign(new Error('The requested resource\ndoes not exist.'), { code: 'ItemNotFound' }))).toBe('The requested resource does not exist. (ItemNotFound)');
    expect(hostErrorMessage('plain')).toBe('plain');
  });

  it('logHostError logs without throwing, also where the helpers\' browser logger cannot run', () => {
    const spy = vi.spyOn(console, 'error').mockImplementation(() => {});
    expect(() => logHostError(new Error('x'))).not.toThrow();
    expect(spy).toHaveBeenCalled();
  });
});
