import { createModel, inputFrame, type Learner, type ModelOptions, type Series } from '../../src/engine';

/** Small networks so that blend and neural fits in tests take seconds (settings for tests, no reference values). */
export const SMALL: ModelOptions = { seed: 4, network: { hiddenLayers: [6], learningRate: 0.05, momentum: 0.5, iterations: 15, ensemble: 2, checkEvery: 5, patience: 2 } };

/** A learner of `kind` with the SMALL settings, fitted on every day of `series`. */
export function fitted(kind: string, series: Series): Learner {
  const model = createModel(kind, SMALL) as Learner;
  model.fit(inputFrame(series));
  return model;
}
