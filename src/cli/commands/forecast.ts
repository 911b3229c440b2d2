import { InputError } from '../../engine';

export interface ForecastFlags {
  model: string;
  input: string;
  out?: string;
  json?: boolean;
}

export async function forecastCommand(_flags: ForecastFlags): Promise<void> {
  throw new InputError('forecast needs a model saved by train, which arrives with the neural model; use backtest with a baseline for now');
}
