import { readFileSync } from 'node:fs';
import { buildSeries, describeIngest, formatTimestamp, InputError, parseCsv, type IngestReport, type Series } from '../engine';

/**
 * Reads a data file as design.md describes it and says on stderr what was
 * found (periods, resolution, gaps, missing prices), so nothing is dropped
 * or filled without the user being told.
 */
export function loadSeries(file: string, zone: string, target = 'price', missing = 'fill'): { series: Series; report: IngestReport } {
  if (missing !== 'fill' && missing !== 'fail') throw new InputError(`--missing must be fill or fail, got "${missing}"`);
  const text = readText(file);
  const result = buildSeries(parseCsv(text, file), { zone, target });
  if (missing === 'fail' && result.report.missingPrices > 0) {
    const i = result.series.price.findIndex(Number.isNaN);
    throw new InputError(
      `${result.report.missingPrices} periods inside the history have no price, the first at ${formatTimestamp(result.series.times[i], zone)} (--missing fail); fill them or use --missing fill`,
      { file },
    );
  }
  for (const line of describeIngest(result.series, result.report)) process.stderr.write(`${file}: ${line}\n`);
  return result;
}

export function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? 'no such file' : `cannot be read (${code ?? 'unknown error'})`, { file });
  }
}

/** A whole-number option, checked: `--retrain-every abc` is a clear error. */
export function intOption(value: string | undefined, flag: string, min: number, fallback: number): number {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < min) throw new InputError(`${flag} must be a whole number of at least ${min}, got "${value}"`);
  return n;
}
