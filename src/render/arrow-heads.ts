/**
 * Small filled triangles along a drawn curve, pointing the way the curve
 * was sampled (increasing frequency), spread evenly over its visible
 * length and never at its very ends.
 */
import { element, px } from './svg/element.js';
import type { SeriesName } from './style/palette.js';
import { SERIES_STYLE } from './style/palette.js';
import type { Point } from './svg/path-data.js';

export function arrowHeads(runs: readonly (readonly Point[])[], count: number, series: SeriesName, scale = 1): string[] {
  const segments: { a: Point; b: Point; length: number }[] = [];
  for (const run of runs) {
    for (let i = 0; i + 1 < run.length; i++) {
      const length = Math.hypot(run[i + 1].x - run[i].x, run[i + 1].y - run[i].y);
      if (length > 0) segments.push({ a: run[i], b: run[i + 1], length });
    }
  }
  const total = segments.reduce((s, g) => s + g.length, 0);
  if (total < 40 * scale) return [];
  const out: string[] = [];
  let k = 0;
  let walked = 0;
  for (let n = 1; n <= count; n++) {
    const target = (total * n) / (count + 1);
    while (k < segments.length - 1 && walked + segments[k].length < target) walked += segments[k++].length;
    const g = segments[k];
    const t = Math.min(1, Math.max(0, (target - walked) / g.length));
    const x = g.a.x + t * (g.b.x - g.a.x);
    const y = g.a.y + t * (g.b.y - g.a.y);
    const angle = (Math.atan2(g.b.y - g.a.y, g.b.x - g.a.x) * 180) / Math.PI;
    const s = 5 * scale;
    out.push(
      element('path', {
        class: 'arrow',
        'data-mark': 'frequency-arrow',
        fill: SERIES_STYLE[series].colour,
        d: `M${px(s)} 0L${px(-s)} ${px(-s * 0.7)}L${px(-s * 0.4)} 0L${px(-s)} ${px(s * 0.7)}Z`,
        transform: `translate(${px(x)} ${px(y)}) rotate(${px(angle)})`,
      }),
    );
  }
  return out;
}
