import { ALL_FEATURE_GROUPS, InputError } from '../../engine';
import { LossChart } from '../charts/loss-chart';
import type { PaneContext } from '../context';
import { clear, field, fmt, guarded, h, messageLine } from '../dom';
import { checkModelName } from '../logic/model-shelf';
import { defaultForm, FIELD_HELP, groupLabel, readTrainForm, type FormField, type TrainForm } from '../logic/settings-form';
import { trainAndSave } from '../jobs/train-and-save';
import { jobProgress } from './job-progress';

const help = (f: FormField) => FIELD_HELP.find((x) => x.field === f)!;

/**
 * Train: choose the model and its settings, train in the worker with a
 * progress bar, a live validation-loss chart and Cancel. The model is saved
 * in the workbook only when training ends well; a cancelled or failed
 * training leaves the workbook as it was.
 */
export function trainSection(ctx: PaneContext): HTMLElement {
  const { store } = ctx;
  const defaults = defaultForm(store.get().region);
  const message = messageLine('train-message');
  const warnings = h('ul', { class: 'loom-warnings', test: 'train-warnings' });
  const result = h('div', { class: 'loom-result', test: 'train-result' });
  const errorsOf = new Map<FormField, HTMLElement>();
  const fieldError = (f: FormField) => {
    const el = h('p', { class: 'loom-field-error', test: `error-${f}`, hidden: true });
    errorsOf.set(f, el);
    return el;
  };

  const name = h('input', { type: 'text', test: 'model-name', value: 'main' });
  const kind = h('select', { test: 'model-kind' },
    h('option', { value: 'blend', text: 'blend (networks + linear)' }),
    h('option', { value: 'neural', text: 'neural networks only' }),
    h('option', { value: 'linear', text: 'linear model only' }));
  kind.value = defaults.kind;
  const text = (f: keyof TrainForm, test: string) => h('input', { type: 'text', test, value: String(defaults[f]) });
  const hidden = text('hiddenLayers', 'hidden-layers');
  const lr = text('learningRate', 'learning-rate');
  const momentum = text('momentum', 'momentum');
  const iterations = text('iterations', 'iterations');
  const ensemble = text('ensemble', 'ensemble');
  const coverage = text('coverage', 'coverage');
  const seed = text('seed', 'seed');
  const groupBoxes = ALL_FEATURE_GROUPS.map((id) => {
    const box = h('input', { type: 'checkbox', test: `group-${id}`, value: id, checked: defaults.groups.includes(id) });
    return { id, box, row: h('label', { class: 'loom-check' }, box, h('span', { text: groupLabel(id) })) };
  });
  const networkOnly = [hidden, lr, momentum, iterations, ensemble];
  const syncKind = () => networkOnly.forEach((el) => (el.disabled = kind.value === 'linear'));
  kind.addEventListener('change', syncKind);

  const form = (): TrainForm => ({
    kind: kind.value,
    groups: groupBoxes.filter((g) => g.box.checked).map((g) => g.id),
    hiddenLayers: hidden.value, learningRate: lr.value, momentum: momentum.value, iterations: iterations.value,
    ensemble: ensemble.value, coverage: coverage.value, seed: seed.value, region: store.get().region,
  });

  const lossBox = h('div', { class: 'loom-chart', test: 'loss-chart' });
  const lossNote = h('p', { class: 'loom-help', test: 'loss-note', text: 'The validation loss appears here while the networks train.' });
  const chart = new LossChart(lossBox);
  const progress = jobProgress(ctx, { progress: 'progress', cancel: 'cancel-button', text: 'progress-text' }, 'train');
  const train = h('button', { class: 'loom-button loom-button-main', type: 'button', test: 'train-button', text: 'Train' });

  train.addEventListener('click', () => guarded(train, message, async () => {
    clear(warnings); clear(result);
    errorsOf.forEach((el) => { el.hidden = true; el.textContent = ''; });
    const data = store.get().data;
    if (!data) throw new InputError('check the data first (Data section): training uses the ranges as checked there');
    const modelName = checkModelName(name.value);
    const checked = readTrainForm(form());
    if (!checked.ok) {
      for (const e of checked.errors) {
        const el = errorsOf.get(e.field === 'region' ? 'kind' : e.field);
        if (el && el.hidden) { el.textContent = e.message; el.hidden = false; }
      }
      throw new InputError(checked.errors[0].message);
    }
    for (const w of checked.warnings) warnings.appendChild(h('li', { text: w }));
    const existing = await ctx.port.loadModels();
    const replacing = modelName in existing;
    if (replacing && !(await ctx.ask(`A model named "${modelName}" is already saved. Train a new one and replace it when training ends?`))) {
      message.info('Nothing trained; pick another model name to keep both.');
      return;
    }
    chart.reset();
    lossNote.textContent = 'The validation loss appears here while the networks train.';
    message.info(`Training a ${checked.settings.kind} model on ${data.series.times.length} periods…`);
    // one line per network of the ensemble: the worker says which network a loss belongs to
    const done = await trainAndSave(progress.run({ type: 'train', series: data.series, settings: checked.settings, name: modelName }, (p) => {
      if (p.what === 'network epochs' && p.loss !== undefined) chart.add(p.network ?? 0, p.epoch ?? p.done, p.loss);
    }), ctx.shelf, modelName, replacing);
    if (chart.points === 0 && checked.settings.kind !== 'linear') lossNote.textContent = 'This engine version reports no validation loss during training; the final validation MAE is shown below.';
    if (done.status === 'cancelled') { message.info('Training cancelled. Nothing was saved.'); return; }
    if (done.status === 'failed') { message.error(done.message); return; }
    if (done.status === 'not saved') { message.info('The trained model was not saved.'); return; }
    const { stored } = done;
    await ctx.refreshModels();
    store.set({ selected: modelName });
    const v = stored.holdout;
    result.appendChild(h('dl', { class: 'loom-facts' },
      h('dt', { text: 'saved as' }), h('dd', { text: modelName, test: 'trained-name' }),
      h('dt', { text: 'trained on' }), h('dd', { text: `${stored.trainedFrom} to ${stored.trainedTo}` }),
      h('dt', { text: 'validation MAE' }), h('dd', { test: 'validation-mae', text: `${fmt(v.mae)} over the last ${v.days} days, which took part in no training choice (linear ${fmt(v.maeLinear)}, neural ${fmt(v.maeNeural)}, naive-week ${fmt(v.maeNaiveWeek)})` }),
      h('dt', { text: 'neural weight' }), h('dd', { text: fmt(stored.neuralWeight) }),
      h('dt', { text: 'inputs that matter most' }), h('dd', { text: stored.importance.slice(0, 4).map((i) => `${i.group} +${fmt(i.increase)}`).join(', ') || 'n/a' }),
    ));
    for (const note of stored.notes) warnings.appendChild(h('li', { text: note }));
    message.ok(`Trained in ${done.seconds.toFixed(1)} s and saved in this workbook as "${modelName}". Check it against the baselines next.`);
  }));

  store.subscribe((st, prev) => { if (st.busy !== prev.busy) train.disabled = Boolean(st.busy); });
  syncKind();

  return h('section', { class: 'loom-section', test: 'section-train', data: { section: 'train' } },
    h('h2', { text: 'Train' }),
    field('Model name', name, 'The name cells use, as in =LOOM.AHEAD("main", …). Letters, digits, spaces and _ . -'),
    field(help('kind').label, kind, help('kind').help, fieldError('kind')),
    h('fieldset', { class: 'loom-groups', test: 'feature-groups' },
      h('legend', { text: help('groups').label }),
      ...groupBoxes.map((g) => g.row),
      h('p', { class: 'loom-help', text: help('groups').help }), fieldError('groups')),
    h('fieldset', { class: 'loom-network', test: 'network-settings' },
      h('legend', { text: 'Network settings' }),
      field(help('hiddenLayers').label, hidden, help('hiddenLayers').help, fieldError('hiddenLayers')),
      field(help('learningRate').label, lr, help('learningRate').help, fieldError('learningRate')),
      field(help('momentum').label, momentum, help('momentum').help, fieldError('momentum')),
      field(help('iterations').label, iterations, help('iterations').help, fieldError('iterations')),
      field(help('ensemble').label, ensemble, help('ensemble').help, fieldError('ensemble')),
      field(help('coverage').label, coverage, help('coverage').help, fieldError('coverage')),
      field(help('seed').label, seed, help('seed').help, fieldError('seed'))),
    h('div', { class: 'loom-actions' }, train),
    progress.el,
    lossBox, lossNote,
    message.el, warnings, result,
  );
}
