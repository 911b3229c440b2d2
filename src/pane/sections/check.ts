import { formatTimestamp, InputError, type BacktestSummary } from '../../engine';
import { drawBacktestChart } from '../charts/backtest-chart';
import type { PaneContext } from '../context';
import { clear, count, field, fmt, guarded, h, messageLine } from '../dom';
import { readArchive } from '../logic/archive';
import { gradeArchive, gradeSummary, LATE_MEANING, type ArchiveGrade } from '../logic/grade-archive';
import { jobProgress } from './job-progress';
import { modelPicker } from './model-picker';
import { whyView } from './why-view';

/**
 * Check: how the picked model would have done over a recent span, walked
 * forward day by day, against the naive-week and weekday-rule baselines;
 * why tomorrow's forecast moves against a reference day (why-view.ts);
 * and how the issued forecasts in the archive did against actual prices.
 */
export function checkSection(ctx: PaneContext): HTMLElement {
  const { store } = ctx;
  const message = messageLine('check-message');
  const picker = modelPicker(ctx, 'check-model');
  const days = h('input', { type: 'text', test: 'check-days', value: '28' });
  const retrain = h('input', { type: 'text', test: 'check-retrain', value: '', placeholder: 'model default' });
  const table = h('div', { class: 'loom-table-wrap', test: 'backtest-table' });
  const chartBox = h('div', { class: 'loom-chart', test: 'backtest-chart' });
  const gradeBox = h('div', { class: 'loom-table-wrap', test: 'grade-table' });
  const progress = jobProgress(ctx, { progress: 'backtest-progress', cancel: 'backtest-cancel', text: 'backtest-progress-text' }, 'backtest');
  let removeChart: () => void = () => {};

  const run = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'backtest-button', text: 'Run backtest' });
  run.addEventListener('click', () => guarded(run, message, async () => {
    const data = store.get().data;
    if (!data) throw new InputError('check the data first (Data section): the backtest uses the prices as checked there');
    const entry = picker.current();
    const span = wholeNumber(days.value, 'the test span', 1);
    const every = retrain.value.trim() === '' ? undefined : wholeNumber(retrain.value, 'retrain every', 0);
    message.info(`Walking ${entry.name} forward over the last ${count(span, 'day')}…`);
    const outcome = await progress.run({ type: 'backtest', series: data.series, settings: entry.stored!.settings, label: entry.name, days: span, retrainEvery: every });
    if (outcome.type === 'cancelled') { message.info('Backtest cancelled.'); return; }
    if (outcome.type === 'failed') { message.error(outcome.message); return; }
    if (outcome.type !== 'backtested') return;
    store.set({ backtest: { model: entry.name, outcome: outcome.outcome } });
    message.ok(`Backtest ${outcome.outcome.testStart} to ${outcome.outcome.testEnd}: the model was trained on the days before, then forecast each day from the days before it only.`);
  }));

  const grade = h('button', { class: 'loom-button', type: 'button', test: 'grade-button', text: 'Grade the archive' });
  const gradeMessage = messageLine('grade-message');
  grade.addEventListener('click', () => guarded(grade, gradeMessage, async () => {
    const data = store.get().data;
    if (!data) throw new InputError('check the data first (Data section): the archive is graded against the prices there');
    const entries = await readArchive(ctx.port);
    if (entries.length === 0) { clear(gradeBox); gradeMessage.info('The forecast archive is empty: each outlook refresh in Place adds to it.'); return; }
    const grades = gradeArchive(entries, data.series);
    store.set({ grades });
    renderGrades(gradeBox, grades, data.series.zone);
    gradeMessage.ok(gradeSummary(grades));
  }));

  store.subscribe((st, prev) => {
    if (st.busy !== prev.busy) run.disabled = Boolean(st.busy);
    if (st.backtest !== prev.backtest) {
      clear(table); removeChart(); clear(chartBox); removeChart = () => {};
      if (!st.backtest) return;
      table.appendChild(scoreTable(st.backtest.outcome.summaries));
      const zone = st.data?.series.zone ?? 'UTC';
      removeChart = drawBacktestChart(chartBox, st.backtest.outcome.rows, zone, st.backtest.model);
    }
  });

  return h('section', { class: 'loom-section', test: 'section-check', data: { section: 'check' } },
    h('h2', { text: 'Check' }),
    field('Model', picker.el, 'The model\'s settings are trained again on the days before the span, then it forecasts each test day from earlier days only.'),
    field('Test span (days)', days, 'The most recent days with prices. Longer spans give steadier scores and take longer.'),
    field('Retrain every (days)', retrain, 'Optional. How often the model learns the newest days during the span; empty uses its default.'),
    h('div', { class: 'loom-actions' }, run),
    progress.el,
    message.el,
    table,
    chartBox,
    whyView(ctx, picker),
    h('h3', { text: 'Issued forecasts' }),
    h('p', { class: 'loom-help', text: `Grades what was issued (the sheet "Forecast archive") against the prices now in Data: for each period, the last forecast issued before its delivery day began. ${LATE_MEANING[0].toUpperCase()}${LATE_MEANING.slice(1)}; a period whose price is not in Data yet is waiting.` }),
    h('div', { class: 'loom-actions loom-actions-message' }, grade, gradeMessage.el),
    gradeBox,
  );
}

function scoreTable(summaries: BacktestSummary[]): HTMLElement {
  const head = ['model', 'MAE', 'RMSE', 'sMAPE %', 'rMAE', 'coverage'];
  return h('table', { class: 'loom-table' },
    h('thead', {}, h('tr', {}, ...head.map((t) => h('th', { text: t })))),
    h('tbody', {}, ...summaries.map((s) => h('tr', { data: { model: s.model } },
      h('th', { text: s.model }),
      h('td', { text: fmt(s.mae), data: { metric: 'mae', value: String(s.mae) } }),
      h('td', { text: fmt(s.rmse), data: { metric: 'rmse' } }),
      h('td', { text: fmt(s.smape), data: { metric: 'smape' } }),
      h('td', { text: fmt(s.rmae, 3), data: { metric: 'rmae' } }),
      h('td', { text: share(s.coverage), data: { metric: 'coverage' } }),
    ))),
    h('caption', { text: `${count(summaries[0]?.days ?? 0, 'day')}, ${count(summaries[0]?.periods ?? 0, 'period')}; rMAE below 1 beats naive-week` }),
  );
}

function renderGrades(box: HTMLElement, grades: ArchiveGrade[], zone: string): void {
  clear(box);
  const name = (g: ArchiveGrade) => h('th', { text: g.model, title: g.from !== undefined ? `graded ${formatTimestamp(g.from, zone)} to ${formatTimestamp(g.to!, zone)}` : '' });
  // two narrow tables rather than one wide one: the pane is about 320 px wide
  box.appendChild(h('table', { class: 'loom-table loom-table-grades', test: 'grade-counts' },
    h('thead', {}, h('tr', {}, ...['issued by', 'graded', 'late', 'waiting'].map((t) => h('th', { text: t })))),
    h('tbody', {}, ...grades.map((g) => h('tr', { data: { model: g.model } },
      name(g),
      h('td', { text: String(g.graded), data: { count: 'graded' } }),
      h('td', { text: String(g.late), data: { count: 'late' } }),
      h('td', { text: String(g.waiting), data: { count: 'waiting' } }),
    ))),
    h('caption', { text: 'periods of the archive; late: issued after the delivery day began; waiting: no price yet' }),
  ));
  box.appendChild(h('table', { class: 'loom-table loom-table-grades', test: 'grade-scores' },
    h('thead', {}, h('tr', {}, ...['issued by', 'MAE', 'RMSE', 'sMAPE %', 'bias', 'coverage'].map((t) => h('th', { text: t })))),
    h('tbody', {}, ...grades.map((g) => h('tr', { data: { model: g.model } },
      name(g),
      h('td', { text: fmt(g.mae), data: { metric: 'mae', value: String(g.mae) } }),
      h('td', { text: fmt(g.rmse) }),
      h('td', { text: fmt(g.smape) }),
      h('td', { text: fmt(g.bias) }),
      h('td', { text: share(g.coverage) }),
    ))),
    h('caption', { text: 'scores of the graded periods (n/a until one is graded)' }),
  ));
}

/** A share as the sheets show it with the number format 0.0% (the same text in pane and sheet). */
export function share(x: number | undefined): string {
  return x === undefined || !Number.isFinite(x) ? '–' : `${(100 * x).toFixed(1)}%`;
}

function wholeNumber(text: string, what: string, min: number): number {
  const n = Number(text.trim());
  if (text.trim() === '' || !Number.isInteger(n) || n < min) throw new InputError(`${what} must be a whole number of at least ${min}, got "${text}"`);
  return n;
}
