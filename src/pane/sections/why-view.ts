import { InputError, REFERENCE_CHOICES, type ReferenceChoice } from '../../engine';
import { writeWithConsent } from '../../host/safe-write';
import { drawContributionBars } from '../charts/contribution-bars';
import type { PaneContext } from '../context';
import { clear, field, fmt, guarded, h, messageLine } from '../dom';
import type { ShelfEntry } from '../logic/model-shelf';
import { parseStep, shown, stepText, whyBlock, whyTomorrow, type WhyTomorrow } from '../logic/why-tomorrow';

/**
 * The "why" view of Check: why tomorrow's forecast differs from the model's
 * forecast of the reference day, as bars per input group (exact Shapley
 * values, engine/explain), with a what-if that changes one driver on
 * tomorrow's periods. It computes in the pane only; the sheet is written
 * only by "Place table", through writeWithConsent.
 */
export function whyView(ctx: PaneContext, picker: { el: HTMLSelectElement; current(): ShelfEntry }): HTMLElement {
  const { store, port, ask } = ctx;
  const message = messageLine('why-message');
  const against = h('select', { test: 'why-against' },
    h('option', { value: 'd-1', text: 'the day before (D-1)' }),
    h('option', { value: 'd-7', text: 'the same weekday a week before (D-7)' }));
  const driver = h('select', { test: 'why-driver' });
  const amount = h('input', { type: 'text', test: 'why-amount', placeholder: '+10', value: '' });
  const unit = h('select', { test: 'why-unit' },
    h('option', { value: 'percent', text: '%' }),
    h('option', { value: 'add', text: 'in the driver\'s unit' }));
  const sensitivity = h('input', { type: 'checkbox', test: 'why-sensitivity' });
  const summary = h('p', { class: 'loom-why-summary', test: 'why-summary' });
  const chart = h('div', { class: 'loom-chart', test: 'why-chart' });
  const sensitivityBox = h('div', { class: 'loom-table-wrap', test: 'why-sensitivity-table' });
  const target = h('input', { type: 'text', test: 'why-address', placeholder: 'Why!A1' });
  const place = h('button', { class: 'loom-button', type: 'button', test: 'why-place', text: 'Place table', disabled: true });
  const run = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'why-button', text: 'Explain tomorrow' });
  let current: WhyTomorrow | undefined;

  const fillDrivers = () => {
    const keep = driver.value;
    clear(driver);
    driver.appendChild(h('option', { value: '', text: 'no what-if' }));
    let names: string[] = [];
    try { names = picker.current().stored!.setup.drivers; } catch { names = []; }
    for (const n of names) driver.appendChild(h('option', { value: n, text: n }));
    driver.value = names.includes(keep) ? keep : '';
  };

  const explain = () => guarded(run, message, async () => {
    const data = store.get().data;
    if (!data) throw new InputError('check the data first (Data section): the explanation uses tomorrow\'s rows as checked there');
    const entry = picker.current();
    const choice = against.value as ReferenceChoice;
    if (!(REFERENCE_CHOICES as readonly string[]).includes(choice)) throw new InputError(`pick a reference day, got "${choice}"`);
    const step = parseStep(driver.value, amount.value, unit.value);
    current = whyTomorrow(entry.stored!, data, choice, step, sensitivity.checked);
    render(current);
    place.disabled = false;
    const e = shown(current);
    message.ok(`${e.day} against ${e.referenceDay}: the bars add up to the change of the mean forecast, ${signed(e.change)}.${current.whatIf ? ` What-if ${stepText(current.whatIf.step)}: not written anywhere.` : ''}`);
  });

  const render = (why: WhyTomorrow) => {
    const e = shown(why);
    const actual = Number.isFinite(e.referenceActualMean) ? `actual mean ${fmt(e.referenceActualMean)}` : 'no known price';
    const whatIf = why.whatIf ? ` With ${stepText(why.whatIf.step)}: ${fmt(e.forecastMean)} instead of ${fmt(why.base.forecastMean)}.` : '';
    summary.textContent = `${e.referenceDay}: ${actual}, the model said ${fmt(e.referenceForecastMean)}. ${e.day}: forecast mean ${fmt(why.base.forecastMean)} (${signed(why.base.change)}).${whatIf}`;
    summary.setAttribute('data-forecast-mean', String(e.forecastMean));
    summary.setAttribute('data-base-mean', String(why.base.forecastMean));
    summary.setAttribute('data-day', e.day);
    summary.setAttribute('data-reference-day', e.referenceDay);
    drawContributionBars(chart, e.contributions, `contributions to the change of ${e.day}'s mean forecast against ${e.referenceDay}, price units`);
    clear(sensitivityBox);
    if (why.sensitivity?.length) {
      sensitivityBox.appendChild(h('table', { class: 'loom-table' },
        h('thead', {}, h('tr', {}, h('th', { text: 'driver' }), h('th', { text: 'forecast change per unit' }))),
        h('tbody', {}, ...why.sensitivity.map((s) => h('tr', { data: { driver: s.driver } }, h('th', { text: s.driver }), h('td', { text: fmt(s.mean, 4), data: { value: String(s.mean) } })))),
        h('caption', { text: 'the driver moved by one of its units on every period of tomorrow (central difference)' })));
    }
  };

  run.addEventListener('click', explain);
  // once shown, the view follows its fields: the bars move with the what-if
  for (const el of [against, driver, unit, amount, sensitivity]) el.addEventListener('change', () => { if (current) explain(); });

  place.addEventListener('click', () => guarded(place, message, async () => {
    if (!current) throw new InputError('explain tomorrow first');
    const anchor = target.value.trim();
    if (!anchor) throw new InputError('type the top-left cell for the table, e.g. Why!A1');
    const block = whyBlock(current, anchor);
    const written = await writeWithConsent(port, ask, block.address, block.values, block.formats);
    if (!written) { message.info('Nothing was written.'); return; }
    message.ok(`Wrote the explanation of ${shown(current).day} to ${block.address}.`);
  }));

  store.subscribe((st, prev) => {
    if (st.models !== prev.models || st.selected !== prev.selected) { fillDrivers(); current = undefined; place.disabled = true; }
    if (st.data !== prev.data) { current = undefined; place.disabled = true; }
  });
  fillDrivers();

  return h('div', { class: 'loom-why', test: 'why-view' },
    h('h3', { text: 'Why tomorrow moves' }),
    h('p', { class: 'loom-help', text: 'Splits the change of tomorrow\'s mean forecast against the model\'s forecast of a reference day into one share per input group; the shares add up to the change. A what-if changes one driver on tomorrow\'s periods and shows the forecast and the bars again; nothing is written unless you place the table.' }),
    field('Compare with', against),
    field('What-if', h('div', { class: 'loom-why-row' }, driver, amount, unit), 'Optional: e.g. a wind forecast +10 %, or temperature +2 in its own unit.'),
    field('Sensitivity', sensitivity, 'Also list the forecast change per unit of each driver.'),
    h('div', { class: 'loom-actions' }, run),
    message.el,
    summary,
    chart,
    sensitivityBox,
    field('Table to', target, 'Top-left cell for the explanation table. You are asked before any non-empty cell is overwritten.'),
    h('div', { class: 'loom-actions' }, place),
  );
}

function signed(v: number): string {
  return `${v >= 0 ? '+' : ''}${fmt(v)}`;
}
