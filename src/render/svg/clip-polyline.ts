/**
 * Clips a polyline to a rectangle with the Liang–Barsky algorithm (Liang &
 * Barsky, "A new concept and method for line clipping", ACM Transactions on
 * Graphics 3(1), 1984), segment by segment, and returns the visible runs.
 * Curves that run off to huge values (an integrator near ω = 0, a roll-off
 * to −300 dB) are cut where they leave the plot, at the right angle, instead
 * of being squashed onto its edge.
 */
import type { Point } from './path-data.js';

export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** The part of segment a→b inside the rectangle as parameters [t0, t1] ⊂ [0, 1], or null. */
export function clipSegment(a: Point, b: Point, r: Rect): [number, number] | null {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, a.x - r.x0],
    [dx, r.x1 - a.x],
    [-dy, a.y - r.y0],
    [dy, r.y1 - a.y],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return null;
      continue;
    }
    const t = q / p;
    if (p < 0) {
      if (t > t1) return null;
      if (t > t0) t0 = t;
    } else {
      if (t < t0) return null;
      if (t < t1) t1 = t;
    }
  }
  return [t0, t1];
}

export function clipPolyline(points: readonly Point[], r: Rect): Point[][] {
  const runs: Point[][] = [];
  let current: Point[] | null = null;
  const at = (a: Point, b: Point, t: number): Point => (t === 0 ? a : t === 1 ? b : { x: a.x + t * (b.x - a.x), y: a.y + t * (b.y - a.y) });
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i];
    const b = points[i + 1];
    const finite = Number.isFinite(a.x) && Number.isFinite(a.y) && Number.isFinite(b.x) && Number.isFinite(b.y);
    const span = finite ? clipSegment(a, b, r) : null;
    if (!span) {
      current = null;
      continue;
    }
    const [t0, t1] = span;
    if (!current || t0 > 0) {
      current = [at(a, b, t0)];
      runs.push(current);
    }
    current.push(at(a, b, t1));
    if (t1 < 1) current = null;
  }
  if (points.length === 1 && Number.isFinite(points[0].x) && points[0].x >= r.x0 && points[0].x <= r.x1 && points[0].y >= r.y0 && points[0].y <= r.y1) {
    runs.push([points[0]]);
  }
  return runs;
}
