import { InputError } from '../engine';
import { customFunctionsApi } from './runtime-shim';

/**
 * Every failure of a cell function becomes the host's error value with a
 * message saying what to fix (shown when the user points at the cell), never
 * a number: an InputError (bad input) is #VALUE! with its own message; any
 * other error (a fault of ours) is #N/A with a short note.
 */
const MAX_MESSAGE = 255;

export function cellError(err: unknown): Error {
  const api = customFunctionsApi();
  if (err instanceof api.Error) return err;
  if (err instanceof InputError) return new api.Error(api.ErrorCode.invalidValue, clip(err.message));
  const detail = err instanceof Error ? err.message : String(err);
  return new api.Error(api.ErrorCode.notAvailable, clip(`Spotloom could not compute this (${detail}); please report it`));
}

/** Runs a cell function's body and maps any failure with cellError. */
export async function guarded<T>(body: () => T | Promise<T>): Promise<T> {
  try {
    return await body();
  } catch (err) {
    throw cellError(err);
  }
}

function clip(message: string): string {
  const one = message.replace(/\s+/g, ' ').trim();
  return one.length > MAX_MESSAGE ? `${one.slice(0, MAX_MESSAGE - 1)}…` : one;
}
