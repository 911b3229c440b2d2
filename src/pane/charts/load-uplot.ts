import type uPlot from 'uplot';

/**
 * uPlot (the charts' library) as a lazy chunk: the pane's start-up script
 * leaves it out, and the first chart fetches it (from the pane's own origin).
 */
let loaded: typeof uPlot | undefined;

export async function loadUplot(): Promise<typeof uPlot> {
  loaded ??= (await import(/* webpackChunkName: "charts" */ 'uplot')).default;
  return loaded;
}

/** uPlot when it is loaded already, else undefined. */
export function uplotIfLoaded(): typeof uPlot | undefined {
  return loaded;
}
