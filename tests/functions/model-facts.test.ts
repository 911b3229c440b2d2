import { describe, expect, it } from 'vitest';
import { MODEL_FIELDS, modelFacts } from '../../src/functions/model-facts';
import { fixture } from './fixture';

describe('modelFacts', () => {
  it('modelFacts(stored) spills every fact as name, value rows', () => {
    const { stored } = fixture();
    const table = modelFacts(stored, null);
    expect(table.map((r) => r[0])).toEqual([...MODEL_FIELDS]);
    const facts = Object.fromEntries(table);
    expect(facts.name).toBe('test-linear');
    expect(facts.kind).toBe('linear');
    expect(facts.trained_range).toBe(`${stored.trainedFrom} to ${stored.trainedTo}`);
    expect(facts.trained_to).toBe('2025-10-25');
    expect(facts.resolution).toBe(60);
    expect(facts.drivers).toBe('temp');
    expect(facts.validation_mae).toBe(stored.holdout.mae);
    expect(facts.tuning_mae).toBe(stored.tuning.mae);
    expect(facts.created).toBe('2025-11-01T08:00:00Z');
  });

  it('modelFacts(stored, field) gives one fact, field names forgiving of case and spaces', () => {
    const { stored } = fixture();
    expect(modelFacts(stored, 'Validation MAE')).toEqual([[stored.holdout.mae]]);
    expect(modelFacts(stored, 'features')).toEqual([[stored.setup.groups.join(', ')]]);
  });

  it('modelFacts refuses an unknown field, listing the known ones', () => {
    const { stored } = fixture();
    expect(() => modelFacts(stored, 'colour')).toThrow(/"colour" is not a model fact; use one of name, kind/);
  });
});
