import { expect } from 'vitest';
import { InputError } from '../../src/engine';

/**
 * Shared settings of the fuzz suite (property-based tests with fast-check).
 *
 * Every property runs from a fixed seed so CI repeats exactly. `npm run fuzz`
 * (tests/fuzz/run.ts) raises the case counts with SPOTLOOM_FUZZ_SCALE and
 * picks a fresh SPOTLOOM_FUZZ_SEED, which it prints; a failure prints the
 * seed and path that fast-check needs to replay it.
 */
export const SEED = Number(process.env.SPOTLOOM_FUZZ_SEED ?? 20_260_701);
export const SCALE = Number(process.env.SPOTLOOM_FUZZ_SCALE ?? 1);

/** fast-check parameters for a property of `runs` cases (scaled), seeded per property by `salt`. */
export function params(runs: number, salt: number) {
  return { seed: SEED + salt * 7919, numRuns: Math.max(1, Math.round(runs * SCALE)) };
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; error: InputError };

/**
 * Runs `f` under the fuzz rule: it returns, or it throws an InputError with a
 * one-line message. Any other exception fails the property.
 */
export function outcome<T>(f: () => T): Outcome<T> {
  try {
    return { ok: true, value: f() };
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    expectClearMessage(error.message);
    return { ok: false, error };
  }
}

/** A message a user can act on: one line, not empty, not a bare internal value. */
export function expectClearMessage(message: string): void {
  expect(message.length).toBeGreaterThan(10);
  expect(message).not.toMatch(/[\r\n]/);
  expect(message).not.toMatch(/\[object Object\]|is not a function|Cannot read prop/);
}

/** Relative closeness that also accepts tiny absolute differences. */
export function close(actual: number, expected: number, rel = 1e-9, abs = 1e-12): boolean {
  if (Number.isNaN(expected)) return Number.isNaN(actual);
  return Math.abs(actual - expected) <= abs + rel * Math.max(Math.abs(expected), Math.abs(actual));
}

/** Zones with the awkward cases: DST, no DST, half- and quarter-hour offsets, a 30-minute DST shift. */
export const ZONES = [
  'Europe/Berlin', 'Europe/London', 'America/New_York', 'America/Sao_Paulo', 'UTC',
  'Australia/Adelaide', 'Asia/Kolkata', 'Asia/Kathmandu', 'Australia/Lord_Howe', 'Pacific/Chatham',
] as const;
