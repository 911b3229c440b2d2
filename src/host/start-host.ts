import { detectHost, isSpreadsheetHost, type HostInfo } from './host-detect';
import { bindWorkbook, type ModelStore } from './model-store';
import { OfficeWorkbook } from './office-workbook';
import type { WorkbookPort } from './workbook-port';

/**
 * Starts the add-in's host side once per page: finds out where it runs and,
 * inside the spreadsheet host, binds the Office workbook so that the cell
 * functions and the pane share its models. Outside the host (the preview)
 * nothing is bound here; the preview binds its in-memory workbook itself.
 *
 * @example const { info, store } = await startHost(); if (!info.inHost) ...
 */
export interface StartedHost {
  info: HostInfo;
  port?: WorkbookPort;
  store?: ModelStore;
}

let started: Promise<StartedHost> | undefined;

export function startHost(): Promise<StartedHost> {
  started ??= detectHost().then((info) => {
    if (!isSpreadsheetHost(info)) return { info };
    const port = new OfficeWorkbook();
    return { info, port, store: bindWorkbook(port) };
  });
  return started;
}
