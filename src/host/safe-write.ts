import type { AskUser, CellValue, NumberFormat, WorkbookPort } from './workbook-port';
import { rangeSize, resizeAddress } from './a1';

/**
 * The one write path: before writing `values` at `address`, count the
 * non-empty target cells; when there are any, ask the user, and write
 * nothing unless they agree.
 *
 * @param formats number formats of the same cells (optional)
 * @returns true when written, false when the user said no
 */
export async function writeWithConsent(port: WorkbookPort, ask: AskUser, address: string, values: CellValue[][], formats?: NumberFormat[][]): Promise<boolean> {
  const target = resizeAddress(address, values.length, values[0]?.length ?? 0);
  const { rows, columns } = rangeSize(target);
  if (rows === 0 || columns === 0) return true;
  const current = await port.readFormulas(target);
  const filled = current.flat().filter((v) => v !== null && v !== '').length;
  if (filled > 0) {
    const ok = await ask(`${target} already holds ${filled} non-empty cell${filled === 1 ? '' : 's'}. Overwrite ${filled === 1 ? 'it' : 'them'}?`);
    if (!ok) return false;
  }
  await port.writeRange(target, values, formats);
  return true;
}
