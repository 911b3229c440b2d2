import { formatA1, parseA1 } from '../../host/a1';

/** A cell-function argument: a range reference, a text or a number. */
export type FormulaArg = { ref: string } | string | number;

/**
 * An absolute reference (`History!$A$2:$A$900`) for an address, so a formula
 * block can be moved or copied without its data references sliding.
 *
 * @example absoluteRef('History!A2:A900') // 'History!$A$2:$A$900'
 */
export function absoluteRef(address: string): string {
  const r = parseA1(address);
  const cells = formatA1({ ...r, sheet: undefined }).replace(/([A-Z]+)(\d+)/g, '$$$1$$$2');
  const withSheet = formatA1({ ...r, rows: 1, columns: 1 });
  const bang = withSheet.lastIndexOf('!');
  return bang >= 0 ? `${withSheet.slice(0, bang + 1)}${cells}` : cells;
}

/**
 * The text of a LOOM cell-function call: `=LOOM.AHEAD("spot", History!$A$2:$A$900, …)`.
 * Texts are quoted with doubled inner quotes; trailing undefined arguments
 * are dropped, inner undefined ones are left empty.
 *
 * @example loomCall('SCORE', [{ ref: 'B2:B9' }, { ref: 'C2:C9' }, 'MAE']) // '=LOOM.SCORE($B$2:$B$9, $C$2:$C$9, "MAE")'
 */
export function loomCall(fn: string, args: (FormulaArg | undefined)[]): string {
  const list = [...args];
  while (list.length && list[list.length - 1] === undefined) list.pop();
  const text = list.map((a) => {
    if (a === undefined) return '';
    if (typeof a === 'number') return String(a);
    if (typeof a === 'string') return `"${a.replace(/"/g, '""')}"`;
    return absoluteRef(a.ref);
  });
  return `=LOOM.${fn}(${text.join(', ')})`;
}

/** True when a formula calls one of our LOOM functions. */
export function isLoomFormula(value: unknown): boolean {
  return typeof value === 'string' && value.startsWith('=') && /\bLOOM\.[A-Z]+\s*\(/i.test(value);
}
