import type { IngestReport } from './build-series';
import { deliveryDays, isComplete } from './delivery-days';
import { formatTimestamp } from './format-timestamp';
import { plural } from './plural';
import type { Series } from './series';

/**
 * Plain-language lines about what ingestion found: size, resolution,
 * daylight-saving days, gaps, sorted rows, missing markers and missing prices.
 */
export function describeIngest(series: Series, report: IngestReport): string[] {
  const days = deliveryDays(series);
  const normal = 1440 / series.resolution;
  const dst = days.filter((d) => isComplete(d) && d.expected !== normal).map((d) => `${d.date} (${d.expected})`);
  const lines = [
    `${plural(report.periods, 'period')} of ${series.resolution} minutes in ${plural(days.length, 'delivery day')}, ${days[0].date} to ${days[days.length - 1].date} (${series.zone})`,
  ];
  if (dst.length) lines.push(`daylight-saving days: ${dst.slice(0, 6).join(', ')}${dst.length > 6 ? ` and ${dst.length - 6} more` : ''}`);
  if (report.outOfOrderRows) lines.push(`${plural(report.outOfOrderRows, 'row')} ${report.outOfOrderRows === 1 ? 'was' : 'were'} out of time order and ${report.outOfOrderRows === 1 ? 'has' : 'have'} been sorted`);
  if (report.gaps.length) {
    const missing = report.gaps.reduce((n, g) => n + g.periods, 0);
    const first = report.gaps[0];
    lines.push(`${plural(report.gaps.length, 'gap')}, ${plural(missing, 'period')} with no row (first at ${formatTimestamp(first.from, series.zone)}); their values count as unknown`);
  }
  if (report.markedUnknown) {
    lines.push(`${plural(report.markedUnknown, 'cell')} held a missing marker such as NA or #N/A and ${report.markedUnknown === 1 ? 'is' : 'are'} read as unknown, like empty cells`);
  }
  if (report.missingPrices) {
    lines.push(`${plural(report.missingPrices, 'period')} ${report.missingPrices === 1 ? 'has' : 'have'} no price; model inputs take the same period of the nearest earlier day, scores skip them`);
  }
  return lines;
}
