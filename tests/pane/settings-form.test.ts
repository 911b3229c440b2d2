import { describe, expect, it } from 'vitest';
import { DEFAULT_LEARNER_SETTINGS, FEATURE_GROUPS } from '../../src/engine';
import { defaultForm, FIELD_HELP, groupLabel, readTrainForm } from '../../src/pane/logic/settings-form';

describe('readTrainForm(form)', () => {
  it('accepts the default form and gives the engine defaults back', () => {
    const result = readTrainForm(defaultForm());
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.settings).toEqual(DEFAULT_LEARNER_SETTINGS);
  });

  it('reads hidden layers as a list and the holiday region', () => {
    const result = readTrainForm({ ...defaultForm('DE'), hiddenLayers: '48, 16' });
    expect(result.ok && result.settings.network.hiddenLayers).toEqual([48, 16]);
    expect(result.ok && result.settings.region).toBe('DE');
  });

  it('refuses text that is not a number, naming the field', () => {
    const result = readTrainForm({ ...defaultForm(), learningRate: 'fast' });
    expect(result).toEqual({ ok: false, errors: [{ field: 'learningRate', message: 'Learning rate: "fast" is not a number' }] });
  });

  it("uses the engine schema's own words for values out of range", () => {
    const momentum = readTrainForm({ ...defaultForm(), momentum: '1' });
    expect(momentum.ok === false && momentum.errors).toEqual([{ field: 'momentum', message: 'Momentum: momentum must be below 1' }]);
    const hidden = readTrainForm({ ...defaultForm(), hiddenLayers: '0' });
    expect(hidden.ok === false && hidden.errors[0]).toEqual({ field: 'hiddenLayers', message: 'Hidden layers: a hidden layer needs at least 1 neuron' });
    const groups = readTrainForm({ ...defaultForm(), groups: [] });
    expect(groups.ok === false && groups.errors[0]).toEqual({ field: 'groups', message: 'Inputs: choose at least one feature group' });
    const coverage = readTrainForm({ ...defaultForm(), coverage: '1.2' });
    expect(coverage.ok === false && coverage.errors[0].field).toBe('coverage');
  });

  it('warns when a large momentum meets a large learning rate (effective step lr / (1 - m), common practice)', () => {
    const result = readTrainForm({ ...defaultForm(), momentum: '0.9', learningRate: '0.05' });
    expect(result.ok && result.warnings[0]).toMatch(/effective step of about 0\.50/);
    const calm = readTrainForm({ ...defaultForm(), momentum: '0.9', learningRate: '0.01' });
    expect(calm.ok && calm.warnings).toEqual([]);
  });

  it('notes that a linear model uses no network settings', () => {
    const result = readTrainForm({ ...defaultForm(), kind: 'linear' });
    expect(result.ok && result.warnings[0]).toMatch(/linear model trains no networks/);
  });
});

describe('FIELD_HELP and groupLabel', () => {
  it('explain every setting in one line, momentum with its learning-rate advice', () => {
    for (const h of FIELD_HELP) expect(h.help).not.toContain('\n');
    expect(FIELD_HELP.find((h) => h.field === 'momentum')!.help).toMatch(/large momentum usually wants a smaller learning rate/);
  });

  it('labels each feature group with the engine label', () => {
    for (const g of FEATURE_GROUPS) expect(groupLabel(g.id)).toBe(g.label);
  });
});
