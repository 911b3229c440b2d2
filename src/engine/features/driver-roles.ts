/**
 * Which driver columns are load and which are renewable infeed, by name.
 * Residual load (load minus wind and solar) sets the marginal plant in a
 * merit-order market (common practice), so it gets its own feature.
 */
export function driverRoles(names: string[]): { load?: string; renewables: string[] } {
  const lower = names.map((n) => n.toLowerCase());
  const loadIndex = lower.findIndex((n) => n.includes('load') || n.includes('demand') || n.includes('consumption'));
  const renewables = names.filter((_, i) => /wind|solar|pv|renew/.test(lower[i]) && i !== loadIndex);
  return { load: loadIndex >= 0 ? names[loadIndex] : undefined, renewables };
}
