/**
 * Chart size from its container: the pane is narrow and resizable, so a
 * chart takes the container's width (at least 240 px) and a fixed height.
 */
export function chartSize(container: HTMLElement, height: number): { width: number; height: number } {
  const width = Math.max(240, Math.floor(container.clientWidth || 320));
  return { width, height };
}

/** Calls `resize` when the container's width changes; returns the stop function. */
export function watchWidth(container: HTMLElement, resize: () => void): () => void {
  if (typeof ResizeObserver === 'undefined') return () => {};
  let last = container.clientWidth;
  const observer = new ResizeObserver(() => {
    if (container.clientWidth !== last) { last = container.clientWidth; resize(); }
  });
  observer.observe(container);
  return () => observer.disconnect();
}
