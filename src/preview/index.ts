/**
 * The standalone preview (webpack entry `preview`, page preview.html): the
 * real task pane, mounted with mountPane on an in-memory workbook that holds
 * the invented demo scenario, beside a small grid of that workbook whose
 * LOOM cells are computed by the very cell functions the add-in registers.
 * Same pane code as in the spreadsheet; only the WorkbookPort differs.
 *
 * The page loads the host's own script (office.js, served from this origin)
 * as the add-in's page does; outside the spreadsheet host it reports no
 * host and the preview goes on without it. Nothing is fetched from the
 * network: the demo data are generated here, models and written cells are
 * kept in this origin's localStorage (the preview's "workbook file").
 */
import '../pane/strict-csp'; // first: before any schema is built (see strict-csp.ts)
import { addDays, dayStartUtc, DEMO_MARKET, prepareHolidays } from '../engine';
import { formatA1 } from '../host/a1';
import { detectHost, hostErrorMessage } from '../host/host-detect';
import { bindWorkbook } from '../host/model-store';
import { writeWithConsent } from '../host/safe-write';
import { clear, h } from '../pane/dom';
import { mountPane, type PaneHandle } from '../pane/mount';
import { CAUTION } from '../pane/logic/outlook-layout';
import { csvSheet } from './csv-sheet';
import { demoWorkbook, MODEL_NAME } from './demo-workbook';
import { gridView } from './grid-view';
import { completeCustomFunctions, quietHostTelemetry } from './host-script';
import { inspector } from './inspector';
import { PreviewWorkbook } from './preview-workbook';
import { WorkbookFile, type KeyValueStorage } from './workbook-file';

const ROOT_ID = 'spotloom-preview';
/** the largest file the preview reads (a browser tab, not the format, is the limit) */
const MAX_FILE_BYTES = 64 * 1024 * 1024;

function browserStorage(): KeyValueStorage | undefined {
  try {
    return window.localStorage;
  } catch {
    return undefined; // storage switched off: the preview works, nothing is kept
  }
}

function linkStyles(): void {
  const link = document.createElement('link');
  link.rel = 'stylesheet';
  link.href = new URL('./preview.css', import.meta.url).href;
  document.head.appendChild(link);
}

async function boot(): Promise<void> {
  const root = document.getElementById(ROOT_ID);
  if (!root) return;
  await prepareHolidays(DEMO_MARKET.region); // the demo market's calendar (one chunk in the browser build)
  quietHostTelemetry();
  completeCustomFunctions();
  linkStyles();
  const demo = demoWorkbook();
  const port = new PreviewWorkbook({ sheets: demo.sheets, file: new WorkbookFile(browserStorage()), selection: 'History!A1' });
  bindWorkbook(port); // the LOOM functions read this workbook's models
  const defaults = { times: demo.ranges.times, prices: demo.ranges.prices, drivers: demo.ranges.drivers, zone: demo.zone, region: demo.region };

  const hostStatus = h('span', { class: 'pv-host', test: 'host-status', text: 'looking for a spreadsheet host…' });
  const storageNote = h('p', { class: 'pv-storage', test: 'storage-note', hidden: true });
  const importNote = h('div', { class: 'pv-import-note', test: 'import-note', hidden: true });
  const fileInput = h('input', { type: 'file', class: 'pv-file', test: 'csv-file', aria: { label: 'CSV file to import' } });
  fileInput.accept = '.csv,text/csv';
  const importButton = h('button', { class: 'loom-button', type: 'button', test: 'csv-import-button', text: 'Import CSV…' });
  const resetButton = h('button', { class: 'loom-button', type: 'button', test: 'reset-button', text: 'Reset workbook' });
  const paneRoot = h('aside', { class: 'pv-pane', test: 'pane-root', aria: { label: 'Spotloom task pane' } });
  const grid = gridView(port);

  clear(root);
  root.appendChild(h('div', { class: 'pv-page' },
    h('header', { class: 'pv-head' },
      h('div', { class: 'pv-title' },
        h('strong', { text: 'Spotloom preview' }),
        h('span', { class: 'pv-sub', text: 'the task pane on a demo workbook in your browser · invented market zone Brindlemoor, invented desk Quillfeather Energy Trading' })),
      h('div', { class: 'pv-actions' }, importButton, fileInput, resetButton),
      hostStatus),
    storageNote,
    importNote,
    h('div', { class: 'pv-main' }, grid.el, paneRoot),
    h('footer', { class: 'pv-foot', text: `${CAUTION} The preview keeps this workbook in your browser's storage for this page only; nothing is sent anywhere.` }),
  ));

  // the demo market lives on its own calendar: its clock starts at 10:00 market time of the day
  // before its "tomorrow", so an outlook issued in the preview is a fair day-ahead forecast
  const demoNow = demoClock(demo.tomorrow, demo.zone);
  let pane: PaneHandle = mountPane(paneRoot, port, { defaults, now: demoNow });
  const remount = (d: typeof defaults) => {
    pane.destroy();
    // an imported file has its own dates: the real clock then
    pane = mountPane(paneRoot, port, { defaults: d });
  };

  port.on((event) => {
    if (event !== 'storage') return;
    storageNote.hidden = !port.storageProblem;
    storageNote.textContent = port.storageProblem ?? '';
  });

  importButton.addEventListener('click', () => fileInput.click());
  fileInput.addEventListener('change', () => {
    const file = fileInput.files?.[0];
    fileInput.value = '';
    if (file) void importFile(file);
  });
  const importFile = async (file: File) => {
    importNote.hidden = false;
    importNote.className = 'pv-import-note';
    clear(importNote);
    importNote.textContent = `Reading ${file.name}…`;
    try {
      if (file.size > MAX_FILE_BYTES) throw new Error(`${file.name} is ${Math.round(file.size / 1048576)} MB; the preview reads files up to ${MAX_FILE_BYTES / 1048576} MB`);
      const sheet = csvSheet(await file.text(), file.name, port.sheetNames());
      await port.ensureSheet(sheet.name);
      const target = formatA1({ sheet: sheet.name, row: 0, column: 0, rows: sheet.grid.length, columns: sheet.grid[0].length });
      if (!(await writeWithConsent(port, pane.ask, target, sheet.grid))) { importNote.textContent = 'Nothing was imported.'; return; }
      grid.goTo(sheet.ranges.times);
      const use = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'csv-use-ranges', text: 'Use these ranges in Data' });
      use.addEventListener('click', () => {
        remount({ ...defaults, times: sheet.ranges.times, prices: sheet.ranges.prices, drivers: sheet.ranges.drivers, region: '' });
        importNote.hidden = true;
      });
      clear(importNote);
      importNote.append(
        h('span', { test: 'import-summary', text: `Imported ${file.name} into the sheet "${sheet.name}": ${sheet.notes.join('; ')}. Timestamps ${sheet.ranges.times}, prices ${sheet.ranges.prices}${sheet.ranges.drivers.length ? `, drivers ${sheet.ranges.drivers.join(', ')}` : ''}.` }),
        use,
      );
    } catch (err) {
      importNote.className = 'pv-import-note pv-import-error';
      importNote.textContent = `Could not import ${file.name}: ${hostErrorMessage(err)}`;
    }
  };

  resetButton.addEventListener('click', () => {
    void pane.ask(`Reset the preview workbook? Its models (such as "${MODEL_NAME}") and every cell written since it opened are forgotten, and the demo workbook opens as new.`).then((yes) => {
      if (!yes) return;
      port.forget();
      window.location.reload();
    });
  });

  detectHost(5000).then((info) => {
    hostStatus.textContent = info.inHost
      ? `inside ${info.host ?? 'a host'}: open the add-in's own task pane there`
      : 'no spreadsheet host (Office.onReady found none): the in-memory workbook stands in for it';
    hostStatus.setAttribute('data-host', info.inHost ? String(info.host) : 'none');
  }, (err) => {
    hostStatus.textContent = `host check failed: ${hostErrorMessage(err)}`;
    hostStatus.setAttribute('data-host', 'none');
  });

  (window as unknown as { spotloomPreview: unknown }).spotloomPreview = inspector(port);
  root.setAttribute('data-ready', 'true');
}

void boot();

/**
 * A clock that runs from 10:00 market time of the day before `tomorrow`
 * (UTC ms), at the real pace.
 */
export function demoClock(tomorrow: string, zone: string, real: () => number = Date.now): () => number {
  const offset = dayStartUtc(addDays(tomorrow, -1), zone) + 10 * 3_600_000 - real();
  return () => real() + offset;
}
