/**
 * Texts that desks' exports write for a value that is not known: `NA`,
 * `N/A`, `#N/A` (the spreadsheet error value as text; `#NV` in German
 * spreadsheets, from memory), `-`, `null`, `NaN`, compared without regard
 * to case and surrounding spaces. A data file's cell holding one of them is
 * unknown, exactly like an empty cell (the one missing-value rule: NaN).
 *
 * @example isMissingMarker(' n/a ') // true
 * Source: common practice of CSV exports (R writes NA, pandas NaN, SQL null).
 */
const MARKERS = new Set(['', 'na', 'n/a', '#n/a', '#nv', '-', 'null', 'nan']);

/** The markers as a user reads them in a message. */
export const MISSING_MARKERS = ['NA', 'N/A', '#N/A', '#NV', '-', 'null', 'NaN'] as const;

/** True for an empty cell or a missing marker (the cell is unknown). */
export function isMissingMarker(text: string): boolean {
  return MARKERS.has(text.trim().toLowerCase());
}
