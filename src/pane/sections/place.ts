import { InputError, storedModelText } from '../../engine';
import { writeWithConsent } from '../../host/safe-write';
import type { PaneContext } from '../context';
import { clear, field, guarded, h, messageLine } from '../dom';
import { modelVersion } from '../logic/archive';
import { freezeLines, freezeSheets, freezeTargets } from '../logic/freeze';
import { OUTLOOK_SHEET, type ScoreLine } from '../logic/outlook-layout';
import { refreshOutlook } from '../logic/refresh-outlook';
import { formulaBlock, valuesBlock, type ScoredRow } from '../logic/place-layout';
import { forecastTomorrow, rowsOfDay } from '../logic/tomorrow';
import type { PaneState } from '../state';
import { modelPicker } from './model-picker';

/**
 * Place: write tomorrow's forecast to the sheet, as values or as a live
 * formula block; rebuild the Outlook sheet (and archive what it issued);
 * freeze the LOOM formulas of any sheets to values for people without the add-in. Every write
 * goes through writeWithConsent, which asks before overwriting a cell.
 */
export function placeSection(ctx: PaneContext): HTMLElement {
  const { store, port, ask } = ctx;
  const message = messageLine('place-message');
  const picker = modelPicker(ctx, 'place-model');
  const mode = h('select', { test: 'place-mode' },
    h('option', { value: 'formulas', text: 'live formula block (=LOOM.AHEAD, =LOOM.BAND, =LOOM.SCORE)' }),
    h('option', { value: 'values', text: 'forecast values (fixed numbers)' }));
  const target = h('input', { type: 'text', test: 'place-address', placeholder: 'Forecast!A1' });
  const useSelection = h('button', { class: 'loom-button loom-button-small', type: 'button', test: 'place-use-selection', text: 'use selection' });
  useSelection.addEventListener('click', () => guarded(useSelection, message, async () => {
    target.value = (await port.selectedAddress()).split(':')[0];
    message.clear();
  }));

  const place = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'place-button', text: 'Place' });
  place.addEventListener('click', () => guarded(place, message, async () => {
    const { data } = need(store.get());
    const entry = picker.current();
    const anchor = target.value.trim();
    if (!anchor) throw new InputError('type the top-left cell to write to, e.g. Forecast!A1, or select it and press "use selection"');
    const ahead = forecastTomorrow(entry.stored!, data);
    // LOOM.AHEAD spills the next delivery day; fixed values may cover every day that has driver rows
    const days = mode.value === 'values' ? ahead.days : ahead.days.slice(0, 1);
    const rows = mode.value === 'values' ? ahead.rows : rowsOfDay(ahead.rows, days[0], data.series.zone);
    const dateSystem = await port.dateSystem();
    const block = mode.value === 'values'
      ? valuesBlock({ anchor, zone: data.series.zone, rows, dateSystem })
      : formulaBlock({ anchor, zone: data.series.zone, dateSystem, rows, model: entry.name, coverage: entry.stored!.settings.coverage, data: data.layout, backtest: backtestRows(store.get(), entry.name) });
    const written = await writeWithConsent(port, ask, block.address, block.values, block.formats);
    if (!written) { message.info('Nothing was written.'); return; }
    const scoreNote = mode.value === 'formulas' && !backtestRows(store.get(), entry.name) ? ' Run a backtest in Check first to add =LOOM.SCORE rows.' : '';
    message.ok(`Wrote ${rows.length} period${rows.length === 1 ? '' : 's'} for ${days.join(', ')} to ${block.address}.${scoreNote}`);
  }));

  const refresh = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'outlook-button', text: 'Refresh outlook' });
  refresh.addEventListener('click', () => guarded(refresh, message, async () => {
    const st = store.get();
    const { data } = need(st);
    const entry = picker.current();
    const stored = entry.stored!;
    const { rows, days } = forecastTomorrow(stored, data);
    const firstDay = rowsOfDay(rows, days[0], data.series.zone);
    const issuedAt = Math.floor(ctx.now() / 1000) * 1000; // whole seconds in the archive
    const archived = await refreshOutlook(port, ask, {
      model: entry.name, coverage: stored.settings.coverage, issuedAt, zone: data.series.zone, dateSystem: await port.dateSystem(),
      rows: firstDay, data: data.layout, scores: scoreLines(st, entry.name),
    }, { model: entry.name, created: stored.createdAt, version: modelVersion(stored.version, storedModelText(stored)) });
    if (!archived) { message.info('The Outlook sheet was left as it was; nothing was archived.'); return; }
    message.ok(`Outlook rebuilt for ${days[0]} (${firstDay.length} period${firstDay.length === 1 ? '' : 's'}); the issued forecast was appended to ${archived}.`);
  }));

  const freezeSheetsBox = h('input', { type: 'text', test: 'freeze-sheets', placeholder: 'all sheets' });
  const freezeMessage = messageLine('freeze-message');
  const freezeReport = h('ul', { class: 'loom-report', test: 'freeze-report' });
  const freeze = h('button', { class: 'loom-button', type: 'button', test: 'freeze-button', text: 'Freeze to values' });
  freeze.addEventListener('click', () => guarded(freeze, freezeMessage, async () => {
    clear(freezeReport);
    const sheets = freezeTargets(freezeSheetsBox.value, await port.listSheets());
    const done = await freezeSheets(port, ask, sheets);
    if (done === undefined) { freezeMessage.info('Nothing was frozen: you said no.'); return; }
    if (done.length === 0) { freezeMessage.info(`There is no LOOM formula on ${sheets.length === 1 ? `the sheet ${sheets[0]}` : 'these sheets'}; nothing to freeze.`); return; }
    const n = done.reduce((k, s) => k + s.formulas.length, 0);
    for (const line of freezeLines(done)) freezeReport.appendChild(h('li', { text: line }));
    freezeMessage.ok(`Froze ${n} LOOM formula${n === 1 ? '' : 's'} to ${n === 1 ? 'its' : 'their'} current values; no LOOM formula is left on ${done.length === 1 ? done[0].sheet : `${done.length} sheets`}.`);
  }));

  return h('section', { class: 'loom-section', test: 'section-place', data: { section: 'place' } },
    h('h2', { text: 'Place' }),
    field('Model', picker.el, 'The model whose forecast is written.'),
    field('What to write', mode, 'A formula block stays live and recomputes when prices change; values are fixed numbers.'),
    field('Top-left cell', target, 'Where the block starts. You are asked before any non-empty cell is overwritten.', useSelection),
    h('div', { class: 'loom-actions' }, place),
    h('h3', { text: 'Outlook sheet' }),
    h('p', { class: 'loom-help', text: `Rebuilds the sheet "${OUTLOOK_SHEET}": tomorrow's forecast with its band, the baselines, recent scores and a chart. Each refresh also appends the forecast as issued to the sheet "Forecast archive", which is never rewritten.` }),
    h('div', { class: 'loom-actions' }, refresh),
    message.el,
    h('h3', { text: 'Freeze to values' }),
    h('p', { class: 'loom-help', text: 'For sending the workbook to people without the add-in: every LOOM formula of the sheets named here becomes the numbers it shows now (the cells it spills into too). Other formulas stay. You are asked first.' }),
    field('Sheets to freeze', freezeSheetsBox, 'Sheet names separated by commas; empty freezes every sheet of the workbook.'),
    h('div', { class: 'loom-actions' }, freeze),
    freezeMessage.el,
    freezeReport,
  );
}

function need(st: PaneState) {
  if (!st.data) throw new InputError('check the data first (Data section): the forecast uses the ranges as checked there');
  return { data: st.data };
}

function backtestRows(st: PaneState, model: string): ScoredRow[] | undefined {
  if (!st.backtest || st.backtest.model !== model) return undefined;
  return st.backtest.outcome.rows.map((r) => ({ time: r.time, actual: r.actual, forecast: r.forecast, naiveWeek: r.naiveWeek }));
}

function scoreLines(st: PaneState, model: string): ScoreLine[] {
  const lines: ScoreLine[] = [];
  if (st.backtest && st.backtest.model === model) {
    const span = `backtest ${st.backtest.outcome.testStart} to ${st.backtest.outcome.testEnd}`;
    for (const s of st.backtest.outcome.summaries) lines.push({ name: s.model, mae: s.mae, rmse: s.rmse, smape: s.smape, rmae: s.rmae, coverage: s.coverage, span });
  }
  for (const g of st.grades ?? []) {
    lines.push({ name: `issued by ${g.model}`, mae: g.mae, rmse: g.rmse, smape: g.smape, rmae: NaN, coverage: g.coverage, span: `archive, ${g.graded} period${g.graded === 1 ? '' : 's'}` });
  }
  return lines;
}
