import { describe, expect, it } from 'vitest';
import { clipPolyline, clipSegment } from '../../../src/render/svg/clip-polyline.js';

const box = { x0: 0, y0: 0, x1: 10, y1: 10 };

// Expected parameters are the closed-form intersections of the segment with the box edges.
describe('Liang–Barsky clipping', () => {
  it('cuts a segment where it crosses the edges', () => {
    // (−5, 5) → (15, 5) enters at x = 0 (t = 0.25) and leaves at x = 10 (t = 0.75).
    expect(clipSegment({ x: -5, y: 5 }, { x: 15, y: 5 }, box)).toEqual([0.25, 0.75]);
    // A diagonal from (−10, −10) to (20, 20) is inside for t ∈ [1/3, 2/3].
    const [a, b] = clipSegment({ x: -10, y: -10 }, { x: 20, y: 20 }, box)!;
    expect(a).toBeCloseTo(1 / 3, 15);
    expect(b).toBeCloseTo(2 / 3, 15);
  });

  it('rejects a segment wholly outside', () => {
    expect(clipSegment({ x: -5, y: 20 }, { x: 15, y: 20 }, box)).toBeNull();
    expect(clipSegment({ x: 11, y: -1 }, { x: 20, y: 5 }, box)).toBeNull();
  });

  it('splits a polyline that leaves and re-enters into runs, keeping the direction of the cut', () => {
    // An integrator's curve comes from far away: (1e9, −1e9) → (5, 5) must enter on the right edge along the same line.
    const runs = clipPolyline([{ x: 5 + 1e9, y: 5 - 1e9 }, { x: 5, y: 5 }, { x: 5, y: 50 }, { x: 8, y: 8 }], box);
    expect(runs.length).toBe(2);
    expect(runs[0][0].x).toBeCloseTo(10, 6);
    expect(runs[0][0].y).toBeCloseTo(0, 6);
    expect(runs[0][1]).toEqual({ x: 5, y: 5 });
    expect(runs[0][2]).toEqual({ x: 5, y: 10 });
    expect(runs[1][runs[1].length - 1]).toEqual({ x: 8, y: 8 });
  });

  it('gaps at non-finite points', () => {
    const runs = clipPolyline([{ x: 1, y: 1 }, { x: 2, y: 2 }, { x: NaN, y: 3 }, { x: 4, y: 4 }, { x: 5, y: 5 }], box);
    expect(runs).toEqual([[{ x: 1, y: 1 }, { x: 2, y: 2 }], [{ x: 4, y: 4 }, { x: 5, y: 5 }]]);
  });
});
