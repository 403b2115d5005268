/**
 * Discretised PID controllers against scipy.signal.cont2discrete
 * (fixtures/discrete/discretisations.json; prewarped Tustin as plain Tustin
 * at the equivalent period 2·tan(ω0Ts/2)/ω0, see the generating script), and
 * against closed forms: the backward-Euler PI ((kp + ki·Ts)z − kp)/(z − 1)
 * (derivation), the exactness of prewarping at ω0 (Åström & Wittenmark,
 * Computer-Controlled Systems, 3rd ed., §8.2), the unfiltered derivative's
 * pole at z = −1 under Tustin and z = 0 under backward Euler (derivation).
 */
import { describe, expect, it } from 'vitest';
import { pidModel } from '../../../src/model/pid.js';
import type { PidController } from '../../../src/model/plant-description.js';
import { discretePidModel } from '../../../src/model/discrete/discrete-pid.js';
import { ModelError } from '../../../src/model/model-error.js';
import { discretisationFixture, normalised } from './fixture.js';

const fixture = discretisationFixture();

describe('discretiseController against scipy.signal.cont2discrete', () => {
  for (const c of fixture.controllers) {
    it(c.name, () => {
      const model = discretePidModel(pidModel(c.controller as unknown as PidController), c.implementation);
      const got = normalised(model.discrete.numerator, model.discrete.denominator);
      const scale = Math.max(...c.expected.numerator.map(Math.abs), 1);
      expect(got.denominator.length).toBe(c.expected.denominator.length);
      expect(got.numerator.length).toBe(c.expected.numerator.length);
      got.denominator.forEach((x, i) => expect(Math.abs(x - c.expected.denominator[i])).toBeLessThan(1e-12 * Math.max(1, Math.abs(c.expected.denominator[i]))));
      got.numerator.forEach((x, i) => expect(Math.abs(x - c.expected.numerator[i])).toBeLessThan(1e-12 * scale));
    });
  }
});

describe('discretiseController closed forms', () => {
  it('backward-Euler PI is ((kp + ki·Ts)z − kp)/(z − 1) (derivation)', () => {
    const kp = 0.8;
    const ki = 2.5;
    const ts = 0.1;
    const m = discretePidModel(pidModel({ kind: 'pid', form: 'parallel', kp, ki }), { samplePeriod: ts, method: 'backward-euler' });
    const g = normalised(m.discrete.numerator, m.discrete.denominator);
    expect(g.numerator[0]).toBeCloseTo(kp + ki * ts, 14);
    expect(g.numerator[1]).toBeCloseTo(-kp, 14);
    expect(g.denominator).toEqual([1, -1]);
    expect(m.integrators).toBe(1);
    // Low-frequency asymptote ki/(jω): the integrator keeps its gain.
    expect(m.lowFrequencyGain).toBeCloseTo(ki, 12);
  });

  it('prewarped Tustin matches C(jω0) exactly at ω0, plain Tustin does not (Åström & Wittenmark §8.2)', () => {
    const c = pidModel({ kind: 'pid', form: 'standard', gain: 2, integralTime: 5, derivativeTime: 1, derivativeFilter: { n: 10 } });
    const ts = 0.5;
    const w0 = 4;
    const warped = discretePidModel(c, { samplePeriod: ts, method: 'tustin-prewarp', prewarpFrequency: w0 });
    const plain = discretePidModel(c, { samplePeriod: ts, method: 'tustin' });
    const exact = c.evaluate(w0, { re: 0, im: 0 });
    const a = warped.evaluate(w0, { re: 0, im: 0 });
    const b = plain.evaluate(w0, { re: 0, im: 0 });
    expect(Math.hypot(a.re - exact.re, a.im - exact.im) / Math.hypot(exact.re, exact.im)).toBeLessThan(1e-13);
    expect(Math.hypot(b.re - exact.re, b.im - exact.im) / Math.hypot(exact.re, exact.im)).toBeGreaterThan(1e-3);
  });

  it('an unfiltered derivative gets a pole at z = −1 under Tustin and at z = 0 under backward Euler; forward Euler refuses it', () => {
    const pd: PidController = { kind: 'pid', form: 'parallel', kp: 1, kd: 0.5 };
    const c = pidModel(pd);
    const tustin = discretePidModel(c, { samplePeriod: 0.1, method: 'tustin' });
    expect(tustin.discrete.poles.map((p) => p.re)).toContain(-1);
    // A pole on the unit circle at the Nyquist frequency π/Ts.
    expect(tustin.imaginaryAxisPoles).toHaveLength(1);
    expect(tustin.imaginaryAxisPoles[0].frequency).toBeCloseTo(Math.PI / 0.1, 10);
    const backward = discretePidModel(c, { samplePeriod: 0.1, method: 'backward-euler' });
    expect(backward.discrete.poles.map((p) => p.re)).toContain(0);
    // Backward Euler: kp + kd(z − 1)/(Ts·z); at z = −1 the gain is kp + 2kd/Ts.
    const v = backward.evaluate(Math.PI / 0.1, { re: 0, im: 0 });
    expect(v.re).toBeCloseTo(1 + (2 * 0.5) / 0.1, 10);
    expect(() => discretePidModel(c, { samplePeriod: 0.1, method: 'forward-euler' })).toThrow(ModelError);
  });

  it('forward Euler with a sample period above twice the filter time constant puts the filter pole outside the unit circle at 1 − Ts/T_filter, derivation', () => {
    const c = pidModel({ kind: 'pid', form: 'parallel', kp: 1.5, kd: 0.2, derivativeFilter: { timeConstant: 0.05 } });
    const m = discretePidModel(c, { samplePeriod: 0.5, method: 'forward-euler' });
    expect(m.discrete.poles[0].re).toBeCloseTo(1 - 0.5 / 0.05, 12);
    expect(m.unstablePoles).toBe(1);
  });
});
