/**
 * A cell's text as it goes into a one-line message: trimmed, clipped to
 * `max` characters, in double quotes, with line breaks and other control
 * characters written as escapes (`\r`, `\n`, `\u0000`), so that no message
 * ever spans lines, whatever a file or a cell holds.
 *
 * @param text - the cell text as read
 * @param max - most characters shown before an ellipsis (default 40)
 * @returns the quoted, escaped text
 * @example quoteCell('12,5\r') // '"12,5\\r"'
 * Source: JSON string escaping (RFC 8259, section 7), common practice.
 */
export function quoteCell(text: string, max = 40): string {
  const t = String(text).trim();
  const clipped = t.length > max ? `${t.slice(0, max)}…` : t;
  return JSON.stringify(clipped).replace(/[\u0085\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}
