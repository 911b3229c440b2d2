import { InputError } from '../errors';
import { Learner } from '../models/learner';
import type { DayAheadModel } from '../models/model';
import type { GroupedModel } from './grouped-model';
import { learnerModel } from './learner-model';

/**
 * The grouped view of a model that can be explained: the learned models
 * (blend, neural, linear). A baseline has no inputs to share out (its
 * forecast is a copy of an earlier day) and `lear` has no adapter yet.
 *
 * @throws InputError for any other model
 */
export function groupedModelOf(model: DayAheadModel): GroupedModel {
  if (model instanceof Learner) {
    if (!model.state) throw new InputError(`model ${model.name} has not been trained yet`);
    return learnerModel(model) as GroupedModel;
  }
  throw new InputError(`model ${model.name} cannot be explained: only the learned models blend, neural and linear split their forecast into input groups; a baseline copies an earlier day, and lear is not supported yet`);
}
