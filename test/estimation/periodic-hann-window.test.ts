import { describe, expect, it } from 'vitest';
import { periodicHannWindow } from '../../src/estimation/periodic-hann-window.js';

describe('periodicHannWindow (Harris 1978, DFT-even Hann)', () => {
  it('is 0 at the start, 1 at the middle and periodic: w[i] = w[n−i]', () => {
    const { window } = periodicHannWindow(16);
    expect(window[0]).toBe(0);
    expect(window[8]).toBe(1);
    for (let i = 1; i < 16; i++) expect(window[i]).toBeCloseTo(window[16 - i], 15);
    expect(window[4]).toBeCloseTo(0.5, 15);
  });

  it('has Σw² = 3n/8 (closed form: Σ(½ − ½cos)² = n/4 + n/8 for n ≥ 3)', () => {
    for (const n of [8, 64, 4096]) expect(periodicHannWindow(n).sumOfSquares).toBeCloseTo((3 * n) / 8, 9);
  });
});
