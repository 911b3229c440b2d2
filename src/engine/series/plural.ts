/**
 * A count with its noun for a message: "1 row", "3 rows". Only regular
 * English plurals (an added "s") are needed in Spotloom's messages.
 *
 * @example plural(1, 'period') // '1 period'
 * Source: common practice.
 */
export function plural(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}
