import { describe, expect, it } from 'vitest';
import { interpolateLogFrequency } from '../../src/render/interpolate-log-frequency.js';

describe('interpolateLogFrequency', () => {
  // A straight line in log-frequency (−20 dB/decade) is reproduced exactly between samples.
  const f = [0.1, 1, 10, 100];
  const db = f.map((w) => -20 * Math.log10(w));
  it('is exact for a curve linear in log ω', () => {
    for (const w of [0.2, 3.16, 42]) expect(interpolateLogFrequency(f, db, w)).toBeCloseTo(-20 * Math.log10(w), 12);
    expect(interpolateLogFrequency(f, db, 10)).toBe(-20);
  });
  it('is NaN outside the samples', () => {
    expect(interpolateLogFrequency(f, db, 0.05)).toBeNaN();
    expect(interpolateLogFrequency(f, db, 101)).toBeNaN();
  });
});
