import { z } from '../schema-config';

/**
 * Training settings of the neural network, checked with a plain message
 * each. Momentum lies in [0, 1); a large momentum usually wants a small
 * learning rate (common practice: the effective step is about lr / (1 − m)).
 */
export const NetworkOptionsSchema = z.object({
  hiddenLayers: z.array(z.number().int('hidden layer sizes must be whole numbers').min(1, 'a hidden layer needs at least 1 neuron').max(512, 'hidden layers above 512 neurons are not supported'))
    .min(1, 'give at least one hidden layer').max(4, 'at most 4 hidden layers'),
  learningRate: z.number().gt(0, 'the learning rate must be above 0').lte(1, 'the learning rate must be at most 1'),
  momentum: z.number().gte(0, 'momentum must be at least 0').lt(1, 'momentum must be below 1'),
  iterations: z.number().int('iterations must be a whole number').min(1, 'iterations must be at least 1').max(100_000, 'iterations must be at most 100000'),
  ensemble: z.number().int('the ensemble size must be a whole number').min(1, 'the ensemble needs at least 1 network').max(10, 'at most 10 networks in the ensemble'),
  /** epochs between validation checks, and checks without improvement before stopping */
  checkEvery: z.number().int().min(1).max(1000),
  patience: z.number().int().min(1).max(1000),
});

export type NetworkOptions = z.infer<typeof NetworkOptionsSchema>;

export const DEFAULT_NETWORK_OPTIONS: NetworkOptions = {
  hiddenLayers: [32],
  learningRate: 0.02,
  momentum: 0.5,
  iterations: 200,
  ensemble: 3,
  checkEvery: 5,
  patience: 4,
};
