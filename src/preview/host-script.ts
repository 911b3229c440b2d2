/**
 * The preview loads the host's own script (office.js) as the add-in's page
 * does. Outside the spreadsheet host that script does two things the
 * preview has to take care of:
 *
 * - it defines a bare global `CustomFunctions` (only `associate`), without
 *   the `Error` class and `ErrorCode` values that the host's custom-functions
 *   runtime brings; the LOOM functions report bad input with those
 *   (src/functions/cell-error.ts), so the preview adds stand-ins, as
 *   src/functions/runtime-shim.ts does when there is no global at all;
 * - its host-mapping part (o15apptofilemappingtable.js) starts a telemetry
 *   logger that, three seconds later, adds a hidden frame pointing at the
 *   publisher's telemetry service. The page's Content-Security-Policy
 *   would block that frame, but the preview sends nothing anywhere, so it
 *   does not let the logger try: its frame loader and log writer are
 *   switched off as soon as the logger exists.
 *
 * Both only touch what the host's script left on the page; in a real host
 * the add-in's own page runs, not the preview.
 */
interface HostGlobals {
  CustomFunctions?: { Error?: unknown; ErrorCode?: unknown };
  OSF?: { Logger?: { ulsEndpoint?: { loadProxyFrame?: () => void; writeLog?: (text: string) => void } | null } };
}

class HostCellError extends Error {
  constructor(readonly code: string, message?: string) {
    super(message ?? code);
    this.name = 'CellError';
  }
}

const ERROR_CODES = {
  invalidValue: '#VALUE!', notAvailable: '#N/A', divisionByZero: '#DIV/0!', invalidNumber: '#NUM!',
  nullReference: '#NULL!', invalidName: '#NAME?', invalidReference: '#REF!',
};

/** Adds the runtime's Error and ErrorCode to a bare CustomFunctions global. */
export function completeCustomFunctions(scope: HostGlobals = globalThis as HostGlobals): void {
  const api = scope.CustomFunctions;
  if (!api) return; // the functions' own shim stands in
  if (typeof api.Error !== 'function') api.Error = HostCellError;
  if (typeof api.ErrorCode !== 'object' || api.ErrorCode === null) api.ErrorCode = ERROR_CODES;
}

/**
 * Switches the host script's telemetry logger off once it exists (checked
 * every 50 ms for `giveUpMs`).
 * @returns a function that stops waiting
 */
export function quietHostTelemetry(scope: HostGlobals = globalThis as HostGlobals, giveUpMs = 15_000): () => void {
  const started = Date.now();
  const quiet = (): boolean => {
    const uls = scope.OSF?.Logger?.ulsEndpoint;
    if (!uls) return false;
    uls.loadProxyFrame = () => undefined;
    uls.writeLog = () => undefined;
    return true;
  };
  if (quiet()) return () => undefined;
  const timer = setInterval(() => {
    if (quiet() || Date.now() - started > giveUpMs) clearInterval(timer);
  }, 50);
  return () => clearInterval(timer);
}
