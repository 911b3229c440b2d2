import { writeWithConsent } from '../../host/safe-write';
import type { AskUser, WorkbookPort } from '../../host/workbook-port';
import { appendToArchive, type Issue } from './archive';
import { OUTLOOK_SHEET, outlookLayout, type OutlookInput } from './outlook-layout';

/**
 * One press of "Refresh outlook": rebuild the Outlook sheet's frame (asking
 * before overwriting, as every write does), draw its native chart, then
 * append the forecast as issued to the archive. When the user says no,
 * nothing is written, charted or archived.
 *
 * @returns the archive range written, or undefined when the user said no
 */
export async function refreshOutlook(port: WorkbookPort, ask: AskUser, input: OutlookInput, issue: Omit<Issue, 'issuedAt' | 'zone'>): Promise<string | undefined> {
  const layout = outlookLayout(input);
  await port.ensureSheet(OUTLOOK_SHEET);
  if (!(await writeWithConsent(port, ask, layout.frame, layout.values, layout.formats))) return undefined;
  await port.addLineChart(layout.chart.sheet, layout.chart.address, layout.chart.title);
  return appendToArchive(port, { ...issue, issuedAt: input.issuedAt, zone: input.zone }, input.rows);
}
