import { byMagnitude, type Contribution } from '../../engine';
import { chartSize } from './chart-size';

/** One bar: a group's contribution from the zero line, in chart pixels. */
export interface Bar {
  group: string;
  value: number;
  x: number;
  width: number;
  y: number;
}

export const BAR_ROW = 20;
const LABEL = 112;
const PAD = 8;
/** room beside the bars for their value labels */
const VALUE = 44;

/**
 * Where the bars of a contribution chart go: one row per group, largest
 * magnitude first, a zero line placed so that the longest bar on each side
 * fits; positive contributions (they raise the forecast) to the right.
 *
 * @example barLayout([{ group: 'a', value: 2 }, { group: 'b', value: -1 }], 300).zero // 112 + 8 + 44 + 32
 */
export function barLayout(items: Pick<Contribution, 'group' | 'value'>[], width: number): { zero: number; bars: Bar[] } {
  const sorted = byMagnitude(items.map((c) => ({ ...c, perSlot: [] })));
  const plot = Math.max(40, width - LABEL - 2 * PAD - 2 * VALUE);
  const up = Math.max(0, ...sorted.map((c) => c.value));
  const down = Math.max(0, ...sorted.map((c) => -c.value));
  const span = up + down || 1;
  const zero = LABEL + PAD + VALUE + (down / span) * plot;
  const bars = sorted.map((c, k) => {
    const w = (Math.abs(c.value) / span) * plot;
    return { group: c.group, value: c.value, x: c.value >= 0 ? zero : zero - w, width: w, y: PAD + k * BAR_ROW };
  });
  return { zero, bars };
}

const SVG = 'http://www.w3.org/2000/svg';

/**
 * Draws the contributions as a small horizontal bar chart (plain SVG, no
 * chart library; colours from pane.css classes, no inline style). Each bar
 * carries data-group and data-value for tests and screen readers.
 */
export function drawContributionBars(box: HTMLElement, items: Contribution[], caption: string): void {
  box.replaceChildren();
  const { width } = chartSize(box, 0);
  const { zero, bars } = barLayout(items, width);
  const height = 2 * PAD + bars.length * BAR_ROW;
  const svg = document.createElementNS(SVG, 'svg');
  const set = (el: Element, attrs: Record<string, string | number>) => { for (const [k, v] of Object.entries(attrs)) el.setAttribute(k, String(v)); return el; };
  set(svg, { width, height, viewBox: `0 0 ${width} ${height}`, role: 'img', 'aria-label': caption, class: 'loom-bars' });
  for (const b of bars) {
    const g = set(document.createElementNS(SVG, 'g'), { 'data-group': b.group, 'data-value': b.value, class: 'loom-bar-row' });
    const label = set(document.createElementNS(SVG, 'text'), { x: LABEL, y: b.y + BAR_ROW * 0.65, 'text-anchor': 'end', class: 'loom-bar-label' });
    label.textContent = b.group;
    const rect = set(document.createElementNS(SVG, 'rect'), { x: b.x, y: b.y + 3, width: Math.max(b.width, 0.5), height: BAR_ROW - 6, class: b.value >= 0 ? 'loom-bar-up' : 'loom-bar-down' });
    const title = document.createElementNS(SVG, 'title');
    title.textContent = `${b.group}: ${b.value >= 0 ? '+' : ''}${b.value.toFixed(2)}`;
    rect.appendChild(title);
    const value = set(document.createElementNS(SVG, 'text'), {
      x: b.value >= 0 ? b.x + b.width + 3 : b.x - 3, y: b.y + BAR_ROW * 0.65, 'text-anchor': b.value >= 0 ? 'start' : 'end', class: 'loom-bar-value',
    });
    value.textContent = `${b.value >= 0 ? '+' : ''}${b.value.toFixed(2)}`;
    g.append(label, rect, value);
    svg.appendChild(g);
  }
  svg.appendChild(set(document.createElementNS(SVG, 'line'), { x1: zero, x2: zero, y1: PAD / 2, y2: height - PAD / 2, class: 'loom-bar-zero' }));
  box.appendChild(svg);
}
