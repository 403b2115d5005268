import { describe, expect, it } from 'vitest';
import { detrendSegment } from '../../src/estimation/detrend-segment.js';

const line = (n: number, a: number, b: number) => Float64Array.from({ length: n }, (_, i) => a + b * i);

describe('detrendSegment', () => {
  it("'linear' removes a straight line exactly", () => {
    const x = line(64, 3.5, -0.25);
    detrendSegment(x, 'linear');
    for (const v of x) expect(Math.abs(v)).toBeLessThan(1e-12);
  });

  it("'linear' leaves a residual orthogonal to 1 and to i (least squares normal equations)", () => {
    const x = Float64Array.from({ length: 33 }, (_, i) => Math.sin(i) + 0.1 * i * i);
    detrendSegment(x, 'linear');
    let s0 = 0;
    let s1 = 0;
    x.forEach((v, i) => {
      s0 += v;
      s1 += v * i;
    });
    expect(Math.abs(s0)).toBeLessThan(1e-10);
    expect(Math.abs(s1)).toBeLessThan(1e-9);
  });

  it("'mean' removes the mean only, so a slope remains", () => {
    const x = line(4, 10, 1); // 10 11 12 13, mean 11.5
    detrendSegment(x, 'mean');
    expect(Array.from(x)).toEqual([-1.5, -0.5, 0.5, 1.5]);
  });

  it("'none' leaves the segment alone", () => {
    const x = line(4, 10, 1);
    detrendSegment(x, 'none');
    expect(Array.from(x)).toEqual([10, 11, 12, 13]);
  });
});
