// The engine's public surface. This file only re-exports.
export * from './errors';

export * from './series/series';
export * from './series/table';
export * from './series/csv-dialect';
export * from './series/missing-markers';
export * from './series/plural';
export * from './series/parse-number';
export * from './series/parse-timestamp';
export * from './series/timestamp-reader';
export * from './series/format-timestamp';
export * from './series/serial-date';
export * from './series/local-clock';
export * from './series/infer-resolution';
export * from './series/build-series';
export * from './series/join-drivers';
export * from './series/join-actuals';
export * from './series/describe-ingest';
export * from './series/delivery-days';
export * from './series/day-matrix';
export * from './series/day-frame';
export * from './series/fill-missing';
export * from './series/input-frame';

export * from './calendar/weekday';
export * from './calendar/holidays';
export * from './calendar/bridge-days';

export * from './metrics/mae';
export * from './metrics/rmse';
export * from './metrics/smape';
export * from './metrics/mape';
export * from './metrics/mape-guarded';
export * from './metrics/mase';
export * from './metrics/mase-scale';
export * from './metrics/rmae';
export * from './metrics/bias';
export * from './metrics/pinball';
export * from './metrics/score-all';
export * from './metrics/metric-by-name';

export * from './compare/diebold-mariano';
export * from './compare/daily-loss-differential';
export * from './compare/compare-forecasts';
export * from './compare/student-t-cdf';

export * from './baselines/naive';
export * from './models/model';
export * from './models/create-model';
export * from './models/learner';
export * from './models/learner-settings';
export * from './models/lear';
export * from './models/lear-calibrate';
export * from './models/lear-features';
export * from './models/network-options';
export * from './features/feature-groups';
export * from './features/day-features';
export * from './backtest/run-backtest';
export * from './backtest/summarise';

export * from './demo/markets';
export * from './demo/generate-market';
export * from './demo/to-csv';
export * from './demo/market-spec';

export * from './model-file/model-schema';
export * from './model-file/save-model';
export * from './model-file/load-model';
export * from './models/forecast-ahead';

export * from './features/group-columns';
export * from './explain/grouped-model';
export * from './explain/shapley';
export * from './explain/contributions';
export * from './explain/learner-model';
export * from './explain/grouped-model-of';
export * from './explain/ahead-day';
export * from './explain/explain-ahead';
export * from './explain/what-if';
export * from './explain/sensitivity';
