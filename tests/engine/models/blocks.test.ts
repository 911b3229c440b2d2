import { describe, expect, it } from 'vitest';
import { trainingBlocks } from '../../../src/engine/models/blocks';

describe('trainingBlocks(days, tuningDays)', () => {
  it.each([
    // 15 % each, at least 14 (or a fifth, when that is less) and at most 91 days (hand-worked)
    [20, { fit: 12, tuning: 4, holdout: 4 }],
    [32, { fit: 20, tuning: 6, holdout: 6 }],
    [56, { fit: 34, tuning: 11, holdout: 11 }],
    [70, { fit: 42, tuning: 14, holdout: 14 }],
    [200, { fit: 140, tuning: 30, holdout: 30 }],
    [900, { fit: 718, tuning: 91, holdout: 91 }],
  ])('cuts %d usable days into fit, tuning and holdout, oldest first', (days, blocks) => {
    expect(trainingBlocks(days)).toEqual(blocks);
  });

  it('takes a tuning length when one is given and keeps the holdout automatic', () => {
    expect(trainingBlocks(200, 20)).toEqual({ fit: 150, tuning: 20, holdout: 30 });
  });
});
