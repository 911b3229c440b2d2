/**
 * The task pane's entry (webpack entry `taskpane`, page taskpane.html).
 *
 * It exports mountPane for any page that brings its own WorkbookPort (the
 * standalone preview mounts the pane on its in-memory workbook), and, on
 * the add-in's own page only (the root element marked data-boot="office"),
 * waits for the host (Office.onReady, inside startHost) and mounts the pane
 * on the Office workbook that the cell functions share.
 */
import './strict-csp'; // first: before any schema is built (see strict-csp.ts)
import { mountPane } from './mount';
// The Office factory: startHost() makes the Office workbook (src/host/office-workbook.ts) and binds it for the cell functions.
import { startHost } from '../host/start-host';

export { mountPane } from './mount';
export type { PaneHandle, PaneOptions } from './mount';
export type { TabId } from './context';

const ROOT_ID = 'spotloom-pane';

async function boot(): Promise<void> {
  const root = typeof document === 'undefined' ? null : document.getElementById(ROOT_ID);
  if (!root || root.getAttribute('data-boot') !== 'office') return;
  const note = (text: string) => {
    while (root.firstChild) root.removeChild(root.firstChild);
    const p = document.createElement('p');
    p.className = 'loom-boot-note';
    p.textContent = text;
    root.appendChild(p);
  };
  try {
    const { port } = await startHost();
    if (!port) {
      note('This page is the Spotloom task pane. Open it from the spreadsheet (Home > Spotloom), or open the standalone preview that npm start prints.');
      return;
    }
    while (root.firstChild) root.removeChild(root.firstChild);
    mountPane(root, port);
  } catch (error) {
    note(`Spotloom could not start: ${error instanceof Error ? error.message.split('\n')[0] : String(error)}`);
  }
}

void boot();
