import { writeWithConsent } from '../../host/safe-write';
import type { AskUser, CellValue, WorkbookPort } from '../../host/workbook-port';
import { isLoomFormula } from './formula-text';

/**
 * What freezing a range writes: every LOOM formula becomes the value it
 * shows now. Cells a LOOM formula spills into read back as plain values and
 * are written as such, so the spilled numbers stay after their formula is
 * gone. Other formulas (a plain `=SUM(...)`) are kept as formulas.
 *
 * @param formulas the range's formulas (readFormulas)
 * @param values the same range's values (readRange)
 * @returns the cells to write and how many LOOM formulas they replace
 * @example freezeValues([['=LOOM.AHEAD("m", A1:A9, B1:B9)']], [[41.5]]) // { values: [[41.5]], frozen: 1 }
 */
export function freezeValues(formulas: CellValue[][], values: CellValue[][]): { values: CellValue[][]; frozen: number } {
  let frozen = 0;
  const out = formulas.map((row, i) => row.map((f, j) => {
    if (isLoomFormula(f)) { frozen++; return values[i]?.[j] ?? ''; }
    if (typeof f === 'string' && f.startsWith('=')) return f;
    return values[i]?.[j] ?? f;
  }));
  return { values: out, frozen };
}

/**
 * Replaces the LOOM formulas of `address` by their current values, after
 * asking the user (through writeWithConsent, with a question saying what
 * freezing means). Nothing is written, and nobody asked, when the range holds
 * no LOOM formula.
 *
 * @returns how many formulas were frozen (0: none there, or the user said no)
 */
export async function freezeRange(port: WorkbookPort, ask: AskUser, address: string): Promise<number> {
  const [formulas, values] = await Promise.all([port.readFormulas(address), port.readRange(address)]);
  const plan = freezeValues(formulas, values);
  if (plan.frozen === 0) return 0;
  const question = `Replace the ${plan.frozen} LOOM formula${plan.frozen === 1 ? '' : 's'} in ${address} by ${plan.frozen === 1 ? 'its' : 'their'} current values? The sheet then shows fixed numbers that no longer update, and opens without the add-in.`;
  const written = await writeWithConsent(port, () => ask(question), address, plan.values);
  return written ? plan.frozen : 0;
}
