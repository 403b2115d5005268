import { describe, expect, it } from 'vitest';
import { brentMaximum } from '../../src/numeric/brent-maximum.js';

describe('brentMaximum', () => {
  it('finds the maximum of x·e^{−x} at x = 1 with value 1/e (closed form)', () => {
    const m = brentMaximum((x) => x * Math.exp(-x), 0.1, 5);
    expect(m.x).toBeCloseTo(1, 7);
    expect(m.value).toBeCloseTo(Math.exp(-1), 14);
  });
  it('finds the resonant peak of a second-order lag 1/(2ζ√(1−ζ²)) at ωn√(1−2ζ²) (Ogata, Modern Control Engineering)', () => {
    const zeta = 0.2;
    const mag = (w: number) => 1 / Math.sqrt((1 - w * w) ** 2 + (2 * zeta * w) ** 2);
    const m = brentMaximum(mag, 0.1, 2);
    expect(m.value).toBeCloseTo(1 / (2 * zeta * Math.sqrt(1 - zeta * zeta)), 13);
    expect(m.x).toBeCloseTo(Math.sqrt(1 - 2 * zeta * zeta), 7);
  });
});
