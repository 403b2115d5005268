import { describe, expect, it } from 'vitest';
import { chooseBand, NEGLIGIBLE_LOOP_GAIN } from '../../src/analysis/frequency-band.js';
import { rationalModel } from '../../src/model/rational-model.js';

describe('chooseBand', () => {
  it('ends where the proven bound of |L| falls below 1e-3, to within 2^(1/16), when that end is the highest', () => {
    // 1e4/(s + 1): the band's other candidates (ten times the corner, the sweep end near 2e4) lie far below 1e7.
    const loop = rationalModel([1e4], [1, 1], 0);
    const band = chooseBand(loop);
    expect(loop.magnitudeBoundAbove(band.max)).toBeLessThan(NEGLIGIBLE_LOOP_GAIN);
    expect(loop.magnitudeBoundAbove(band.max / Math.pow(2, 1 / 16))).toBeGreaterThanOrEqual(NEGLIGIBLE_LOOP_GAIN);
    // Closed form: |L(jω)| = 1e4/√(1 + ω²) reaches 1e-3 at ω ≈ 1e7; every frequency above the band's end is below it.
    expect(band.max).toBeGreaterThanOrEqual(1e7 * (1 - 1e-9));
    expect(band.max).toBeLessThan(1e7 * Math.pow(2, 1 / 16) * 1.001);
  });

  it('with a delay: the band still holds every point where |L| ≥ 1e-3, and it is no longer up to twice too long', () => {
    // 1.8·e^{−14 s}/((95 s + 1)(22 s + 1)): |P| ≈ 1.8/(2090 ω²) falls through 1e-3 near 0.93 rad/s, above ten
    // times the highest corner (1/14 s⁻¹ → 0.71 rad/s), so the bound's crossing sets the band's end.
    const plant = rationalModel([1.8], [95 * 22, 95 + 22, 1], 14);
    const band = chooseBand(plant);
    expect(plant.magnitudeBoundAbove(band.max)).toBeLessThan(NEGLIGIBLE_LOOP_GAIN);
    const v = { re: 0, im: 0 };
    for (let w = band.max; w < 100 * band.max; w *= 1.01) {
      plant.evaluate(w, v);
      expect(Math.sqrt(v.re * v.re + v.im * v.im)).toBeLessThan(NEGLIGIBLE_LOOP_GAIN);
    }
    expect(band.max).toBeGreaterThanOrEqual(band.sweepTo);
    expect(plant.magnitudeBoundAbove(band.max / Math.pow(2, 1 / 16))).toBeGreaterThanOrEqual(NEGLIGIBLE_LOOP_GAIN);
  });
});
