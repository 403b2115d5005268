/**
 * Plants given in z, and the model of a discrete transfer function: the two
 * coefficient orders describe the same G(z) (a difference equation
 * a0·y_k + a1·y_{k−1} = b0·u_k + b1·u_{k−1} has G(z) = (b0z + b1)/(a0z + a1):
 * derivation), integrators are poles at z = 1 with the low-frequency
 * asymptote K0/(jω) where K0 = R(1)/Ts (e^{jωTs} − 1 ≈ jωTs: derivation), and
 * the unit circle maps to the imaginary axis by s = ln(z)/Ts.
 */
import { describe, expect, it } from 'vitest';
import { companionRealisation } from '../../../src/model/discrete/companion-realisation.js';
import { discretePlantModel } from '../../../src/model/discrete/discrete-plant.js';
import { discreteRationalModel } from '../../../src/model/discrete/discrete-model.js';
import { ModelError } from '../../../src/model/model-error.js';

describe('discretePlantModel', () => {
  it('ascending powers of z⁻¹ and descending powers of z give the same response', () => {
    const ts = 0.1;
    const a = discretePlantModel({ kind: 'transfer-function', samplePeriod: ts, numerator: [0.2, 0.1], denominator: [1, -1.5, 0.7] });
    const b = discretePlantModel({ kind: 'transfer-function', samplePeriod: ts, coefficientOrder: 'ascending-powers-of-inverse-z', numerator: [0, 0.2, 0.1], denominator: [1, -1.5, 0.7] });
    for (const w of [0.1, 3, 17, Math.PI / ts]) {
      const x = a.evaluate(w, { re: 0, im: 0 });
      const y = b.evaluate(w, { re: 0, im: 0 });
      expect(Math.hypot(x.re - y.re, x.im - y.im)).toBeLessThan(1e-14 * Math.hypot(x.re, x.im));
    }
    // Direct check at z = e^{jθ}: (0.2z + 0.1)/(z² − 1.5z + 0.7).
    const t = 0.7;
    const z = { re: Math.cos(t), im: Math.sin(t) };
    const z2 = { re: z.re * z.re - z.im * z.im, im: 2 * z.re * z.im };
    const n = { re: 0.2 * z.re + 0.1, im: 0.2 * z.im };
    const d = { re: z2.re - 1.5 * z.re + 0.7, im: z2.im - 1.5 * z.im };
    const dd = d.re * d.re + d.im * d.im;
    const v = a.evaluate(t / ts, { re: 0, im: 0 });
    expect(v.re).toBeCloseTo((n.re * d.re + n.im * d.im) / dd, 14);
    expect(v.im).toBeCloseTo((n.im * d.re - n.re * d.im) / dd, 14);
  });

  it('a whole-sample delay becomes z^(−d); the relative degree in z counts it', () => {
    const g = discretePlantModel({ kind: 'zeros-poles', samplePeriod: 0.5, zeros: [], poles: [0.5], gain: 1, delay: 1.5 });
    expect(g.discrete.delaySamples).toBe(3);
    expect(g.relativeDegree).toBe(4);
    const v = g.evaluate(1, { re: 0, im: 0 });
    const theta = 0.5;
    // e^{−j3θ}/(e^{jθ} − 0.5)
    const dr = Math.cos(theta) - 0.5;
    const di = Math.sin(theta);
    const m = 1 / Math.hypot(dr, di);
    const ph = -3 * theta - Math.atan2(di, dr);
    expect(v.re).toBeCloseTo(m * Math.cos(ph), 14);
    expect(v.im).toBeCloseTo(m * Math.sin(ph), 14);
  });

  it('integrators are poles at z = 1, with the asymptote K0/(jω), K0 = R(1)/Ts', () => {
    const ts = 0.2;
    // 0.3/((z − 1)(z − 0.6)): R(1) = 0.3/0.4
    const g = discretePlantModel({ kind: 'zeros-poles', samplePeriod: ts, zeros: [], poles: [1, 0.6], gain: 0.3 });
    expect(g.integrators).toBe(1);
    expect(g.lowFrequencyGain).toBeCloseTo(0.3 / 0.4 / ts, 13);
    const w = 1e-5;
    const v = g.evaluate(w, { re: 0, im: 0 });
    expect(Math.hypot(v.re, v.im) * w).toBeCloseTo(0.3 / 0.4 / ts, 6);
  });

  it('the unit circle maps to the imaginary axis: poles on it, outside it, at z = 0', () => {
    const ts = 0.1;
    const g = discreteRationalModel({
      samplePeriod: ts,
      numerator: [1],
      denominator: { leading: 1, rootsMinusOne: [{ re: Math.cos(0.4) - 1, im: Math.sin(0.4) }, { re: Math.cos(0.4) - 1, im: -Math.sin(0.4) }, { re: 0.5, im: 0 }, { re: -1, im: 0 }] },
    });
    expect(g.imaginaryAxisPoles).toHaveLength(1);
    expect(g.imaginaryAxisPoles[0].frequency).toBeCloseTo(0.4 / ts, 12);
    expect(g.unstablePoles).toBe(1); // z = 1.5
    expect(g.poles).toHaveLength(3); // z = 0 has no continuous equivalent
  });

  it('refuses what is not a causal plant', () => {
    expect(() => discretePlantModel({ kind: 'transfer-function', samplePeriod: 0.1, numerator: [1, 0], denominator: [1] })).toThrow(ModelError);
    expect(() => discretePlantModel({ kind: 'zeros-poles', samplePeriod: 0.1, zeros: [0.1, 0.2], poles: [0.5], gain: 1 })).toThrow(ModelError);
    expect(() => companionRealisation([1, 2, 3], [1, 1])).toThrow(expect.objectContaining({ code: 'improper_plant' }));
  });
});
