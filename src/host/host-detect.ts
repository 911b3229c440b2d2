import * as helpersModule from '@microsoft/office-js-helpers';

// a CommonJS bundle: bundlers expose its exports by name, Node's ESM loader under `default`
type Helpers = typeof helpersModule;
const OfficeHelpers: Helpers = 'Utilities' in helpersModule ? helpersModule : (helpersModule as unknown as { default: Helpers }).default;

/**
 * Where the add-in runs: inside the spreadsheet host (Office.js initialised
 * with a host) or as a plain web page (the standalone preview, tests).
 *
 * Office.onReady says which host it is; when the host's script is on the
 * page but never initialises (a page opened outside the host), the helpers'
 * own check (`Utilities.host`, which falls back to what the host leaves in
 * session storage) decides, after a timeout. Host and platform names are
 * the helpers' constants (`EXCEL`, `PC`, `MAC`, `OFFICE_ONLINE`, ...).
 */
export interface HostInfo {
  inHost: boolean;
  host: string | null;
  platform: string | null;
}

const OUTSIDE: HostInfo = { inHost: false, host: null, platform: null };

export async function detectHost(timeoutMs = 10_000): Promise<HostInfo> {
  const office = (globalThis as { Office?: typeof Office }).Office;
  if (!office || typeof office.onReady !== 'function') return OUTSIDE;
  const ready = await Promise.race([
    office.onReady().then((info) => info as { host: unknown; platform: unknown }),
    new Promise<undefined>((resolve) => setTimeout(() => resolve(undefined), timeoutMs)),
  ]);
  if (ready?.host) {
    return { inHost: true, host: helperName(OfficeHelpers.HostType, ready.host), platform: helperName(OfficeHelpers.PlatformType, ready.platform) };
  }
  try {
    const host = OfficeHelpers.Utilities.host;
    return host && host !== OfficeHelpers.HostType.WEB ? { inHost: true, host, platform: OfficeHelpers.Utilities.platform ?? null } : OUTSIDE;
  } catch {
    return OUTSIDE;
  }
}

/** True when the host is the spreadsheet application. */
export function isSpreadsheetHost(info: HostInfo): boolean {
  return info.inHost && info.host === OfficeHelpers.HostType.EXCEL;
}

/**
 * Logs a host error with what the host adds to it (the Office.js error's
 * debug info: the failing statement and its location), grouped in the
 * console by the helpers' logger; plain errors are logged as they are.
 */
export function logHostError(err: unknown): void {
  try {
    OfficeHelpers.Utilities.log(err instanceof Error || typeof err === 'string' ? err : String(err));
  } catch {
    console.error(err); // the helpers' logger needs a browser window
  }
}

/**
 * One line for the user from any error: our InputError's message as it is,
 * a host error with its code, anything else with its message.
 */
export function hostErrorMessage(err: unknown): string {
  if (err instanceof Error) {
    const code = (err as { code?: unknown }).code;
    const text = err.message.replace(/\s+/g, ' ').trim();
    return typeof code === 'string' && !text.includes(code) ? `${text} (${code})` : text;
  }
  return String(err);
}

function helperName(table: Record<string, string>, value: unknown): string | null {
  if (value === null || value === undefined) return null;
  const text = String(value);
  const hit = Object.values(table).find((v) => v.toLowerCase() === text.toLowerCase());
  if (hit) return hit;
  // Office.js platform names that differ from the helpers' constants
  const alias: Record<string, string> = { officeonline: 'OFFICE_ONLINE', pc: 'PC', mac: 'MAC', ios: 'IOS' };
  return alias[text.toLowerCase()] ?? text.toUpperCase();
}
