import { ahead, band, baseline, compare, explain, holiday, model, score } from '../functions/functions';

/**
 * The LOOM cell functions as the preview grid calls them: the very
 * functions the add-in registers with the host (src/functions/functions.ts),
 * with the shape of each parameter as their metadata (functions.json) states
 * it: a `matrix` parameter gets rows × columns of cell values, a `scalar`
 * one a single value. `required` is the number of leading parameters that
 * may not be omitted; `readsModels` says the result depends on the models
 * saved in the workbook, not only on the arguments.
 *
 * @example LOOM_FUNCTIONS.SCORE.params // ['matrix', 'matrix', 'scalar', 'matrix']
 */
export type ParamShape = 'matrix' | 'scalar';

export interface LoomFunction {
  // the functions' own signatures differ; the evaluator passes what the shapes say
  call: (...args: never[]) => Promise<unknown>;
  params: ParamShape[];
  required: number;
  readsModels?: boolean;
}

export const LOOM_FUNCTIONS: Record<string, LoomFunction> = {
  AHEAD: { call: ahead, params: ['scalar', 'matrix', 'matrix', 'matrix', 'matrix'], required: 3, readsModels: true },
  BAND: { call: band, params: ['scalar', 'matrix', 'matrix', 'matrix', 'matrix', 'scalar'], required: 3, readsModels: true },
  BASELINE: { call: baseline, params: ['matrix', 'matrix', 'scalar', 'scalar'], required: 2 },
  SCORE: { call: score, params: ['matrix', 'matrix', 'scalar', 'matrix'], required: 2 },
  COMPARE: { call: compare, params: ['matrix', 'matrix', 'matrix', 'scalar', 'matrix'], required: 3 },
  HOLIDAY: { call: holiday, params: ['scalar', 'scalar'], required: 2 },
  MODEL: { call: model, params: ['scalar', 'scalar'], required: 1, readsModels: true },
  EXPLAIN: { call: explain, params: ['scalar', 'matrix', 'matrix', 'matrix', 'matrix', 'scalar'], required: 3, readsModels: true },
};
