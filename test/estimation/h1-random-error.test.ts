import { describe, expect, it } from 'vitest';
import { h1RandomError } from '../../src/estimation/index.js';
import { seededGaussian } from './support/seeded-noise.js';

describe('h1RandomError: ε = √(1−γ²)/(|γ|√(2nd)) (Bendat & Piersol, Random Data, 4th ed., from memory)', () => {
  it('is 0 at γ² = 1, Infinity at γ² = 0 and 1/4 at γ² = ½ with nd = 8 (the formula by hand)', () => {
    expect(h1RandomError(1, 10)).toEqual({ magnitudeRelative: 0, phaseStdRad: 0 });
    expect(h1RandomError(0, 10).magnitudeRelative).toBe(Infinity);
    expect(h1RandomError(0.5, 8).magnitudeRelative).toBeCloseTo(0.25, 15);
    expect(h1RandomError(0.5, 8).phaseStdRad).toBeCloseTo(0.25, 15);
  });

  it('rejects coherence outside [0, 1] and non-integer or zero averages', () => {
    expect(() => h1RandomError(1.01, 4)).toThrow(RangeError);
    expect(() => h1RandomError(NaN, 4)).toThrow(RangeError);
    expect(() => h1RandomError(0.5, 0)).toThrow(RangeError);
    expect(() => h1RandomError(0.5, 2.5)).toThrow(RangeError);
  });

  it('agrees with a Monte Carlo simulation of the H1 estimator at one bin (within 5 %)', () => {
    // Check of the from-memory constant by simulation: nd independent segments,
    // complex Gaussian U and output noise N, Y = H·U + N, H1 = Σ conj(U)Y / Σ|U|².
    // True coherence γ² = |H|²σu² / (|H|²σu² + σn²). Derivation for this model:
    // std(|H1|)/|H| = √(1−γ²)/(|γ|√(2(nd−1))), i.e. the formula times √(nd/(nd−1)).
    const nd = 64;
    const H = { re: 0.6, im: -0.8 }; // |H| = 1
    const noiseStd = 0.5; // per complex sample, σu = 1 → γ² = 1/(1 + 0.25) = 0.8
    const gamma2 = 1 / (1 + noiseStd * noiseStd);
    const trials = 20000;
    const g = seededGaussian(7);
    let sumMag = 0;
    let sumMag2 = 0;
    let sumPh2 = 0;
    const truePhase = Math.atan2(H.im, H.re);
    for (let t = 0; t < trials; t++) {
      let cre = 0;
      let cim = 0;
      let p = 0;
      for (let s = 0; s < nd; s++) {
        const ur = g() * Math.SQRT1_2;
        const ui = g() * Math.SQRT1_2;
        const yr = H.re * ur - H.im * ui + noiseStd * Math.SQRT1_2 * g();
        const yi = H.re * ui + H.im * ur + noiseStd * Math.SQRT1_2 * g();
        cre += ur * yr + ui * yi;
        cim += ur * yi - ui * yr;
        p += ur * ur + ui * ui;
      }
      const mag = Math.hypot(cre, cim) / p;
      sumMag += mag;
      sumMag2 += mag * mag;
      let dph = Math.atan2(cim, cre) - truePhase;
      dph = Math.atan2(Math.sin(dph), Math.cos(dph));
      sumPh2 += dph * dph;
    }
    const meanMag = sumMag / trials;
    const stdMag = Math.sqrt(sumMag2 / trials - meanMag * meanMag);
    const stdPhase = Math.sqrt(sumPh2 / trials);
    const predicted = h1RandomError(gamma2, nd);
    const finiteNd = Math.sqrt(nd / (nd - 1));
    expect(Math.abs(stdMag / (predicted.magnitudeRelative * finiteNd) - 1)).toBeLessThan(0.05);
    expect(Math.abs(stdPhase / (predicted.phaseStdRad * finiteNd) - 1)).toBeLessThan(0.05);
    // H1 is unbiased for noise on the output only.
    expect(Math.abs(meanMag - 1)).toBeLessThan(0.01);
  });
});
