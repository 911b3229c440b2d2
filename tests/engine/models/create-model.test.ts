import { describe, expect, it } from 'vitest';
import { createModel, DEFAULT_LEARNER_SETTINGS, InputError, Learner, MODEL_NAMES } from '../../../src/engine';

describe('createModel(name, options)', () => {
  it('knows the three learned models, the LEAR benchmark and the three baselines', () => {
    expect([...MODEL_NAMES]).toEqual(['blend', 'neural', 'linear', 'lear', 'naive-day', 'naive-week', 'weekday-rule']);
  });

  it.each([...MODEL_NAMES])('gives a fresh model named %s', (name) => {
    const model = createModel(name);
    expect(model.name).toBe(name);
    expect(model.minHistoryDays).toBeGreaterThanOrEqual(1);
    expect(createModel(name)).not.toBe(model);
  });

  it('makes the learned kinds Learners with the defaults and the options given', () => {
    const model = createModel('linear', { scaleWindow: 14, network: { ...DEFAULT_LEARNER_SETTINGS.network, ensemble: 2 } }) as Learner;
    expect(model).toBeInstanceOf(Learner);
    expect(model.settings.kind).toBe('linear');
    expect(model.settings.scaleWindow).toBe(14);
    expect(model.settings.network.ensemble).toBe(2);
    expect(model.settings.coverage).toBe(DEFAULT_LEARNER_SETTINGS.coverage);
    expect(model.state).toBeUndefined();
  });

  it('fills network options that are not given from the defaults', () => {
    const model = createModel('neural', { network: { iterations: 5 } as never }) as Learner;
    expect(model.settings.network).toEqual({ ...DEFAULT_LEARNER_SETTINGS.network, iterations: 5 });
  });

  it('refuses out-of-range options with the schema message', () => {
    expect(() => createModel('blend', { scaleWindow: 3 })).toThrow(InputError);
    expect(() => createModel('blend', { scaleWindow: 3 })).toThrow('the scaling window needs at least 7 days');
  });

  it.each(['', 'Blend', 'naive', 'ridge', 'toString'])('refuses the unknown name %j and lists the known ones', (name) => {
    expect(() => createModel(name)).toThrow(InputError);
    expect(() => createModel(name)).toThrow(`unknown model "${name}"; choose one of blend, neural, linear, lear, naive-day, naive-week, weekday-rule`);
  });
});
