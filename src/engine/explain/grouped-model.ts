import type { DayFrame } from '../series/day-frame';

/**
 * What the explanation needs from a model: its inputs for a day split into
 * named groups (the players of the Shapley game), a way to mix two days'
 * inputs group by group, and one forward pass. Kept this small so that the
 * explanation does not depend on any model's internals; each model kind
 * gets an adapter (learner-model.ts).
 *
 * `Inputs` is the adapter's own, opaque to the explanation.
 */
export interface GroupedModel<Inputs = unknown> {
  /** the players, in a fixed order (the feature groups' ids) */
  readonly groups: string[];
  /** the inputs for day `d` of `frame` (reading only what a forecast of d may read), or undefined when one is unknown */
  inputsOf(frame: DayFrame, d: number): Inputs | undefined;
  /** the inputs of day D for the groups with `fromD(g)`, those of day R for the rest */
  switched(d: Inputs, r: Inputs, fromD: (g: number) => boolean): Inputs;
  /** the point forecast per clock slot of the day, without input checks */
  forecast(inputs: Inputs): Float64Array;
}
