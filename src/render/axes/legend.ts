/** A one-row legend: a short stroke in each series' style, then its name. */
import { element, textElement } from '../svg/element.js';
import type { SeriesName } from '../style/palette.js';

export interface LegendEntry {
  series: SeriesName;
  label: string;
}

export function drawLegend(entries: readonly LegendEntry[], x: number, y: number): string {
  const out: string[] = [];
  let cx = x;
  for (const e of entries) {
    out.push(element('line', { class: `curve series-${e.series}`, x1: cx, y1: y - 4, x2: cx + 22, y2: y - 4 }));
    out.push(textElement(e.label, { class: 'legend-label', x: cx + 27, y }));
    cx += 27 + 6.2 * e.label.length + 18;
  }
  return element('g', { class: 'legend' }, out);
}
