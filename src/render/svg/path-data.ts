/**
 * Path data for a polyline through screen points, with a gap wherever a
 * point is not finite (a curve that leaves the plotted range is drawn in
 * pieces rather than joined across the gap).
 */
import { px } from './element.js';

export interface Point {
  x: number;
  y: number;
}

export function polylinePath(points: readonly Point[]): string {
  let d = '';
  let pen = false;
  for (const p of points) {
    if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${px(p.x)} ${px(p.y)}`;
    pen = true;
  }
  return d;
}

/** Parses what polylinePath writes back into runs of points (for tests and the page's checks). */
export function parsePolylinePath(d: string): Point[][] {
  const runs: Point[][] = [];
  for (const m of d.matchAll(/([ML])(-?[\d.]+(?:e-?\d+)?) (-?[\d.]+(?:e-?\d+)?)/g)) {
    if (m[1] === 'M') runs.push([]);
    runs[runs.length - 1].push({ x: Number(m[2]), y: Number(m[3]) });
  }
  return runs;
}

/** Path data for several runs (as clipPolyline returns them). */
export function runsPath(runs: readonly (readonly Point[])[]): string {
  return runs.map((run) => polylinePath(run)).join('');
}
