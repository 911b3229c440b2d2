import { columnName, formatA1, parseA1, type A1Range } from '../host/a1';
import { clear, h } from '../pane/dom';
import { cellText, typedValue } from './cell-text';
import { drawSheetChart } from './sheet-chart';
import type { PreviewWorkbook } from './preview-workbook';

/**
 * The preview's own small grid: sheet tabs, a name box (type an address to
 * go there and select it), a formula bar (shows the formula or value of the
 * selected cell; type and press Enter to write that cell yourself), the
 * cells of the active sheet and the line charts drawn on it.
 *
 * Only the rows in view are in the page (a sheet of 10,000 rows scrolls as
 * smoothly as one of 10). Selecting cells with the mouse (drag, or click
 * and shift-click) sets the workbook's selection, which the pane's "use
 * selection" buttons read. Formula cells show their computed value; cells a
 * formula spills into are marked; error cells show the error value, with
 * its message in the cell's title and in the formula bar's status.
 *
 * Test hooks: name-box, formula-input, cell-value (data-value, data-error),
 * calc-status (data-state), sheet-tab (data-sheet), grid, and each cell's
 * data-address (A1 on the active sheet).
 */
export const ROW_HEIGHT = 22;
const ROW_HEAD_WIDTH = 52;
const OVERSCAN = 12;
const EXTRA_ROWS = 30;
const EXTRA_COLUMNS = 4;

export interface GridView {
  el: HTMLElement;
  /** shows the sheet and selects the range (with its sheet) */
  goTo(address: string): void;
  /** a one-line note in the status line */
  note(text: string, kind?: 'info' | 'error'): void;
}

export function gridView(port: PreviewWorkbook): GridView {
  const nameBox = h('input', { class: 'pv-name-box', type: 'text', test: 'name-box', aria: { label: 'Selected range (type an address and press Enter)' } });
  const formulaInput = h('input', { class: 'pv-formula', type: 'text', test: 'formula-input', aria: { label: 'Formula or value of the selected cell' } });
  const valueOut = h('output', { class: 'pv-value', test: 'cell-value' });
  const calcStatus = h('span', { class: 'pv-calc', test: 'calc-status' });
  const status = h('p', { class: 'pv-status', test: 'grid-status', role: 'status' });
  const tabs = h('div', { class: 'pv-tabs', role: 'tablist', test: 'sheet-tabs', aria: { label: 'Sheets' } });
  const colgroup = h('colgroup');
  const headRow = h('tr');
  const body = h('tbody');
  const table = h('table', { class: 'pv-grid' }, colgroup, h('thead', {}, headRow), body);
  const scroller = h('div', { class: 'pv-scroll', test: 'grid', role: 'grid', aria: { label: 'Cells of the active sheet' } }, table);
  scroller.tabIndex = 0;
  const charts = h('div', { class: 'pv-charts', test: 'sheet-charts' });
  const el = h('section', { class: 'pv-sheet', test: 'workbook' },
    h('div', { class: 'pv-bar' }, nameBox, h('span', { class: 'pv-fx', text: 'fx' }), formulaInput, calcStatus),
    valueOut,
    scroller,
    tabs,
    status,
    charts,
  );

  let sheet = port.activeSheet();
  let size = { rows: 0, columns: 0 };
  let widths: number[] = [];
  let anchor = { row: 0, column: 0 };
  let dragging = false;
  let frame = 0;
  let chartStops: (() => void)[] = [];

  const selection = (): A1Range => port.selectionNow();

  const renderTabs = () => {
    clear(tabs);
    for (const name of port.sheetNames()) {
      const on = name === sheet;
      const tab = h('button', { class: on ? 'pv-tab pv-tab-on' : 'pv-tab', type: 'button', role: 'tab', test: 'sheet-tab', data: { sheet: name }, text: name, aria: { selected: String(on) } });
      tab.addEventListener('click', () => goTo(formatA1({ sheet: name, row: 0, column: 0, rows: 1, columns: 1 })));
      tabs.appendChild(tab);
    }
  };

  const measure = () => {
    const ext = port.extent(sheet);
    size = { rows: Math.max(ext.rows + EXTRA_ROWS, 40), columns: Math.max(ext.columns + EXTRA_COLUMNS, 8) };
    const grid = port.grid(sheet);
    widths = Array.from({ length: size.columns }, (_, c) => {
      let longest = 0;
      for (let r = 0; r < Math.min(grid.length, 60); r++) {
        const v = grid[r]?.[c];
        const text = typeof v === 'string' && v.startsWith('=') ? '00000000.00' : cellText(v ?? null);
        longest = Math.max(longest, Math.min(text.length, 34));
      }
      return Math.max(64, Math.min(260, 7 * longest + 14));
    });
    // a fixed-layout table takes its columns' widths only when its own width is set
    table.style.width = `${ROW_HEAD_WIDTH + widths.reduce((a, b) => a + b, 0)}px`;
    clear(colgroup);
    const rowHead = h('col', { class: 'pv-col-head' });
    rowHead.style.width = `${ROW_HEAD_WIDTH}px`;
    colgroup.appendChild(rowHead);
    clear(headRow);
    headRow.appendChild(h('th', { class: 'pv-corner' }));
    widths.forEach((w, c) => {
      const col = h('col');
      col.style.width = `${w}px`; // CSSOM, allowed under style-src 'self'
      colgroup.appendChild(col);
      headRow.appendChild(h('th', { class: 'pv-col-name', text: columnName(c) }));
    });
  };

  const renderRows = () => {
    frame = 0;
    const top = Math.max(0, Math.floor(scroller.scrollTop / ROW_HEIGHT) - OVERSCAN);
    const visible = Math.ceil((scroller.clientHeight || 480) / ROW_HEIGHT) + 2 * OVERSCAN;
    const bottom = Math.min(size.rows, top + visible);
    const sel = selection();
    const onSheet = sel.sheet?.toLowerCase() === sheet.toLowerCase();
    clear(body);
    const spacer = (height: number) => {
      const tr = h('tr', { class: 'pv-spacer' });
      const td = h('td');
      td.colSpan = size.columns + 1;
      td.style.height = `${height}px`;
      tr.appendChild(td);
      return tr;
    };
    if (top > 0) body.appendChild(spacer(top * ROW_HEIGHT));
    for (let r = top; r < bottom; r++) {
      const tr = h('tr');
      tr.appendChild(h('th', { class: 'pv-row-name', text: String(r + 1) }));
      for (let c = 0; c < size.columns; c++) {
        const view = port.cell(sheet, r, c);
        const classes = ['pv-cell'];
        const td = h('td', { data: { address: `${columnName(c)}${r + 1}`, row: String(r), column: String(c) } });
        if (view.result) {
          classes.push(view.result.error ? 'pv-error' : 'pv-formula-cell');
          if (view.result.error) { td.title = view.result.error.message; td.setAttribute('data-error', view.result.error.code); }
          if (view.result.spill) classes.push('pv-spill-anchor');
        } else if (typeof view.raw === 'string' && view.raw.startsWith('=')) {
          classes.push('pv-pending');
        }
        if (view.spilled) classes.push('pv-spilled');
        if (typeof view.value === 'number') { classes.push('pv-number'); td.setAttribute('data-value', String(view.value)); }
        else if (view.value !== null) td.setAttribute('data-value', String(view.value));
        if (onSheet && r >= sel.row && r < sel.row + sel.rows && c >= sel.column && c < sel.column + sel.columns) {
          classes.push(r === anchor.row && c === anchor.column ? 'pv-sel pv-anchor' : 'pv-sel');
        }
        td.className = classes.join(' ');
        td.textContent = view.result && !view.result.error && view.value === null ? '' : cellText(view.value, view.format);
        tr.appendChild(td);
      }
      body.appendChild(tr);
    }
    if (bottom < size.rows) body.appendChild(spacer((size.rows - bottom) * ROW_HEIGHT));
  };

  const later = () => { if (!frame) frame = requestAnimationFrame(renderRows); };

  const renderBar = () => {
    const sel = selection();
    nameBox.value = formatA1(sel);
    const view = port.cell(sheet, anchor.row, anchor.column);
    if (document.activeElement !== formulaInput) formulaInput.value = view.raw === null ? '' : String(view.raw);
    formulaInput.placeholder = view.spilled ? `spilled value ${cellText(view.value)} (from a formula above or to the left)` : '';
    const error = view.result?.error;
    valueOut.textContent = error ? `${error.code} ${error.message}` : view.value === null ? '' : `= ${typeof view.value === 'number' ? String(view.value) : cellText(view.value)}`;
    valueOut.setAttribute('data-value', view.value === null ? '' : String(view.value));
    if (error) valueOut.setAttribute('data-error', error.code); else valueOut.removeAttribute('data-error');
    valueOut.className = error ? 'pv-value pv-value-error' : 'pv-value';
  };

  const renderCalc = () => {
    const busy = port.calculating;
    calcStatus.textContent = busy ? 'calculating…' : 'calculated';
    calcStatus.setAttribute('data-state', busy ? 'calculating' : 'ready');
    calcStatus.setAttribute('data-count', String(port.calculations));
  };

  const renderCharts = () => {
    chartStops.forEach((stop) => stop());
    chartStops = [];
    clear(charts);
    for (const chart of port.charts(sheet)) {
      const box = h('figure', { class: 'pv-chart', test: 'sheet-chart', data: { title: chart.title } });
      charts.appendChild(box);
      const at = parseA1(chart.address);
      void port.readRange(formatA1({ ...at, sheet })).then((values) => {
        // categories as the cells show them (a date-time cell by its number format), as the host's chart labels them
        const labelled = values.map((row, i) => [cellText(row[0], port.format(sheet, at.row + i, at.column)), ...row.slice(1)]);
        if (box.isConnected) chartStops.push(drawSheetChart(box, chart.title, labelled));
      }).catch(() => box.appendChild(h('figcaption', { text: `${chart.title}: the chart's cells cannot be read` })));
    }
  };

  const all = () => { measure(); renderTabs(); renderRows(); renderBar(); renderCalc(); renderCharts(); };

  const goTo = (address: string) => {
    const r = parseA1(address);
    const target = r.sheet === undefined ? sheet : port.sheetName(r.sheet);
    if (!target) throw new Error(`there is no sheet named "${r.sheet}"`);
    port.select(formatA1({ ...r, sheet: target }));
    anchor = { row: r.row, column: r.column };
    const switched = target !== sheet;
    sheet = target;
    if (switched) { scroller.scrollTop = 0; all(); }
    const rowTop = r.row * ROW_HEIGHT;
    if (rowTop < scroller.scrollTop || rowTop > scroller.scrollTop + scroller.clientHeight - 3 * ROW_HEIGHT) {
      scroller.scrollTop = Math.max(0, rowTop - 3 * ROW_HEIGHT);
    }
    renderRows();
    renderBar();
  };

  const selectCells = (from: { row: number; column: number }, to: { row: number; column: number }) => {
    const row = Math.min(from.row, to.row), column = Math.min(from.column, to.column);
    port.select(formatA1({ sheet, row, column, rows: Math.abs(from.row - to.row) + 1, columns: Math.abs(from.column - to.column) + 1 }));
    renderRows();
    renderBar();
  };

  const cellOf = (target: EventTarget | null) => {
    const td = (target as HTMLElement | null)?.closest?.('td[data-row]');
    return td ? { row: Number(td.getAttribute('data-row')), column: Number(td.getAttribute('data-column')) } : undefined;
  };

  scroller.addEventListener('scroll', later);
  scroller.addEventListener('mousedown', (e) => {
    const at = cellOf(e.target);
    if (!at) return;
    e.preventDefault();
    scroller.focus();
    if (!e.shiftKey) anchor = at;
    dragging = true;
    selectCells(anchor, at);
  });
  scroller.addEventListener('mouseover', (e) => {
    if (!dragging) return;
    const at = cellOf(e.target);
    if (at) selectCells(anchor, at);
  });
  window.addEventListener('mouseup', () => { dragging = false; });
  scroller.addEventListener('keydown', (e) => {
    const moves: Record<string, [number, number]> = { ArrowUp: [-1, 0], ArrowDown: [1, 0], ArrowLeft: [0, -1], ArrowRight: [0, 1] };
    const m = moves[e.key];
    if (m) {
      e.preventDefault();
      anchor = { row: Math.max(0, anchor.row + m[0]), column: Math.max(0, anchor.column + m[1]) };
      goTo(formatA1({ sheet, ...anchor, rows: 1, columns: 1 }));
    } else if (e.key === 'Enter' || e.key === 'F2') {
      e.preventDefault();
      formulaInput.focus();
    }
  });

  nameBox.addEventListener('keydown', (e) => {
    if (e.key !== 'Enter') return;
    e.preventDefault();
    try {
      goTo(nameBox.value.trim());
      view.note('');
      scroller.focus();
    } catch (err) {
      view.note(`"${nameBox.value}" is not a range here: ${err instanceof Error ? err.message : String(err)}`, 'error');
    }
  });
  formulaInput.addEventListener('keydown', (e) => {
    if (e.key === 'Escape') { formulaInput.blur(); renderBar(); scroller.focus(); return; }
    if (e.key !== 'Enter') return;
    e.preventDefault();
    const address = formatA1({ sheet, ...anchor, rows: 1, columns: 1 });
    // the user's own typing into a cell, as in any spreadsheet (the add-in's writes go through writeWithConsent)
    port.writeRange(address, [[typedValue(formulaInput.value)]]).then(() => {
      view.note('');
      formulaInput.blur();
      goTo(formatA1({ sheet, row: anchor.row + 1, column: anchor.column, rows: 1, columns: 1 }));
      scroller.focus();
    }, (err) => view.note(err instanceof Error ? err.message : String(err), 'error'));
  });

  port.on((event) => {
    if (event === 'sheets') { renderTabs(); return; }
    if (event === 'calculating') { renderCalc(); return; }
    if (event === 'charts') { renderCharts(); return; }
    if (event === 'selection') {
      const s = selection();
      if (s.sheet && s.sheet !== sheet) { sheet = s.sheet; anchor = { row: s.row, column: s.column }; all(); return; }
      if (!dragging) anchor = { row: s.row, column: s.column };
      later();
      renderBar();
      return;
    }
    if (event === 'cells') { measure(); renderRows(); renderBar(); renderCalc(); renderCharts(); }
  });

  const view: GridView = {
    el,
    goTo,
    note(text, kind = 'info') {
      status.textContent = text;
      status.className = `pv-status pv-status-${kind}`;
    },
  };
  const first = selection();
  anchor = { row: first.row, column: first.column };
  all();
  return view;
}
