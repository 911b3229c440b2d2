/**
 * Links the pane's stylesheet once per document. webpack 5 turns
 * `new URL('./pane.css', import.meta.url)` into an emitted asset and its
 * URL, so the sheet is served from the pane's own origin and a strict
 * `style-src 'self'` allows it; no style is ever injected inline.
 */
export function ensurePaneStyles(doc: Document = document): void {
  if (doc.querySelector('link[data-spotloom-styles]')) return;
  const link = doc.createElement('link');
  link.rel = 'stylesheet';
  link.href = new URL('./pane.css', import.meta.url).href;
  link.setAttribute('data-spotloom-styles', '');
  doc.head.appendChild(link);
}
