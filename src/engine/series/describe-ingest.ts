import type { IngestReport } from './build-series';
import { deliveryDays, isComplete } from './delivery-days';
import { formatTimestamp } from './format-timestamp';
import type { Series } from './series';

/**
 * Plain-language lines about what ingestion found: size, resolution,
 * daylight-saving days, gaps, sorted rows and missing prices.
 */
export function describeIngest(series: Series, report: IngestReport): string[] {
  const days = deliveryDays(series);
  const normal = 1440 / series.resolution;
  const dst = days.filter((d) => isComplete(d) && d.expected !== normal).map((d) => `${d.date} (${d.expected})`);
  const lines = [
    `${report.periods} periods of ${series.resolution} minutes in ${days.length} delivery days, ${days[0].date} to ${days[days.length - 1].date} (${series.zone})`,
  ];
  if (dst.length) lines.push(`daylight-saving days: ${dst.slice(0, 6).join(', ')}${dst.length > 6 ? ` and ${dst.length - 6} more` : ''}`);
  if (report.outOfOrderRows) lines.push(`${report.outOfOrderRows} rows were out of time order and have been sorted`);
  if (report.gaps.length) {
    const missing = report.gaps.reduce((n, g) => n + g.periods, 0);
    const first = report.gaps[0];
    lines.push(`${report.gaps.length} gaps, ${missing} periods with no row (first at ${formatTimestamp(first.from, series.zone)}); their values count as unknown`);
  }
  if (report.missingPrices) {
    lines.push(`${report.missingPrices} periods have no price; model inputs take the same period of the nearest earlier day, scores skip them`);
  }
  return lines;
}
