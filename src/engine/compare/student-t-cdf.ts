// @ts-ignore -- jstat ships without type declarations; the one function used is typed below.
import jstatModule from 'jstat';

const jStat = jstatModule as { studentt: { cdf(x: number, dof: number): number } };

/**
 * Cumulative distribution function of Student's t distribution, P(T <= x)
 * with `df` degrees of freedom (jstat's `studentt.cdf`, accurate to about
 * 1e-8; ±Infinity give 1 and 0 exactly).
 *
 * @param x - the point
 * @param df - degrees of freedom, > 0
 * @returns P(T <= x)
 * @example studentTCdf(2.228, 10) // 0.975 (two-sided 5% critical value of t(10))
 * Source: jstat 1.9.6 (registry package `jstat`).
 */
export function studentTCdf(x: number, df: number): number {
  if (x === Infinity) return 1;
  if (x === -Infinity) return 0;
  return jStat.studentt.cdf(x, df);
}
