/**
 * The one error shape of Spotloom. Every problem a user can fix (a bad file,
 * a bad cell argument, an option out of range) is an `InputError` whose
 * message is one line: where it happened, then what is wrong and what to do.
 *
 * Example: `prices.csv: row 14, column "price": "abc" is not a number`.
 */
export interface Where {
  file?: string;
  row?: number;
  column?: string;
}

export class InputError extends Error {
  readonly where: Where;

  constructor(what: string, where: Where = {}) {
    super(formatWhere(where) + what);
    this.name = 'InputError';
    this.where = where;
  }
}

function formatWhere({ file, row, column }: Where): string {
  const parts: string[] = [];
  if (row !== undefined) parts.push(`row ${row}`);
  if (column !== undefined) parts.push(`column "${column}"`);
  const place = parts.join(', ');
  if (file && place) return `${file}: ${place}: `;
  if (file) return `${file}: `;
  if (place) return `${place}: `;
  return '';
}

/** Throws an InputError unless `condition` holds; keeps range checks to one line. */
export function require(condition: boolean, what: string, where?: Where): asserts condition {
  if (!condition) throw new InputError(what, where);
}
