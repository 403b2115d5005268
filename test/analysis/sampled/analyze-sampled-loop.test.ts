/**
 * The sampled-loop review against
 *  - the closed form for P control of a held first-order lag K/(τs + 1):
 *    a = e^{−Ts/τ}, b = K(1 − a), L(z) = kp·b/(z − a), closed-loop pole
 *    a − kp·b, unstable when kp > (1 + a)/(K(1 − a)); gain margin
 *    (1 + a)/(kp·b) at the Nyquist frequency; phase margin from
 *    |e^{jθ} − a| = kp·b (derivation; Åström & Wittenmark, Computer-Controlled
 *    Systems, 3rd ed., §3.2 for the pole);
 *  - the continuous phase margin 180° − atan(ωc·τ), ωc = √((K·kp)² − 1)/τ,
 *    which the sampled one approaches as Ts → 0, by about ωc·Ts/2 (the hold's
 *    phase lag, exact for the hold itself: derivation);
 *  - sampled loops in fixtures/discrete/discretisations.json (numpy roots of
 *    the characteristic polynomial, scipy brentq crossings on the unit circle).
 */
import { describe, expect, it } from 'vitest';
import { analyzeSampledLoop } from '../../../src/analysis/sampled/analyze-sampled-loop.js';
import { DEFAULT_CRITERIA } from '../../../src/analysis/criteria.js';
import { discretePidModel } from '../../../src/model/discrete/discrete-pid.js';
import { discreteProduct } from '../../../src/model/discrete/discrete-product.js';
import { heldPlantModel } from '../../../src/model/discrete/sampled-plant.js';
import { pidModel } from '../../../src/model/pid.js';
import type { PidController } from '../../../src/model/plant-description.js';
import { transferFunctionModel } from '../../../src/model/plants/transfer-function.js';
import { discretePlantModel } from '../../../src/model/discrete/discrete-plant.js';
import { polynomialRoots } from '../../../src/numeric/polynomial-roots.js';
import { discretisationFixture } from '../../model/discrete/fixture.js';

const options = { criteria: DEFAULT_CRITERIA, includeResponse: false };

function firstOrderLoop(k: number, tau: number, kp: number, ts: number, method: 'tustin' | 'backward-euler' = 'tustin') {
  const plant = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator: [k], denominator: [tau, 1] }), ts);
  const controller = discretePidModel(pidModel({ kind: 'pid', form: 'parallel', kp }), { samplePeriod: ts, method });
  return discreteProduct(controller, plant);
}

describe('P control of a held first-order lag (closed forms)', () => {
  const k = 2;
  const tau = 0.5;
  const ts = 0.25;
  const a = Math.exp(-ts / tau);
  const b = k * (1 - a);
  const limit = (1 + a) / (k * (1 - a));

  it('gain margin (1 + a)/(kp·b) at π/Ts and the phase margin from |e^{jθ} − a| = kp·b', () => {
    const kp = 1.5;
    const r = analyzeSampledLoop(firstOrderLoop(k, tau, kp, ts), options);
    expect(r.stability.closedLoopStable).toBe(true);
    expect(r.margins.gain!.frequency).toBe(Math.PI / ts);
    expect(Math.abs(r.margins.gain!.ratio - (1 + a) / (kp * b)) / ((1 + a) / (kp * b))).toBeLessThan(1e-12);
    const cosTheta = (1 + a * a - (kp * b) ** 2) / (2 * a);
    const theta = Math.acos(cosTheta);
    const pm = 180 - (Math.atan2(Math.sin(theta), cosTheta - a) * 180) / Math.PI;
    expect(r.margins.phase!.degrees).toBeCloseTo(pm, 9);
    expect(r.margins.phase!.frequency).toBeCloseTo(theta / ts, 9);
    // Closed-loop pole a − kp·b, the only root.
    expect(r.stability.closedLoopPoles).toHaveLength(1);
    expect(r.stability.closedLoopPoles![0].re).toBeCloseTo(a - kp * b, 14);
  });

  it('becomes unstable just above kp = (1 + a)/(K(1 − a)) although the continuous loop is stable for every kp > 0', () => {
    const below = analyzeSampledLoop(firstOrderLoop(k, tau, limit * 0.999, ts), options);
    const above = analyzeSampledLoop(firstOrderLoop(k, tau, limit * 1.001, ts), options);
    expect(below.stability.closedLoopStable).toBe(true);
    expect(above.stability.closedLoopStable).toBe(false);
    expect(above.stability.nyquist.closedLoopUnstablePoles).toBe(1);
    expect(above.stability.closedLoopPoles![0].re).toBeCloseTo(a - limit * 1.001 * b, 13);
    expect(above.stability.closedLoopPoles![0].re).toBeLessThan(-1);
    expect(above.warnings.map((w) => w.code)).toContain('closed_loop_unstable');
    expect(above.warnings.find((w) => w.code === 'closed_loop_unstable')!.message).toMatch(/outside the unit circle/);
    // The gain margin says the same: a ratio just below 1.
    expect(above.margins.gain!.ratio).toBeCloseTo(1 / 1.001, 12);
  });

  it('the sampled phase margin tends to the continuous one as Ts → 0, short of it by about ωc·Ts/2', () => {
    const kp = 3;
    const wc = Math.sqrt((k * kp) ** 2 - 1) / tau;
    const continuous = 180 - (Math.atan(wc * tau) * 180) / Math.PI;
    const gaps: number[] = [];
    for (const t of [0.02, 0.002, 0.0002]) {
      const r = analyzeSampledLoop(firstOrderLoop(k, tau, kp, t), options);
      const gap = continuous - r.margins.phase!.degrees;
      gaps.push(gap);
      const holdLag = ((wc * t) / 2) * (180 / Math.PI);
      // P control has no discretisation error: the gap is the hold's, to first order in Ts
      // (the relative remainder shrinks in proportion to ωc·Ts).
      expect(Math.abs(gap - holdLag) / holdLag).toBeLessThan(0.3 * wc * t);
      expect(r.margins.phase!.frequency).toBeCloseTo(wc, 0);
    }
    expect(gaps[1]).toBeLessThan(gaps[0] / 5);
    expect(gaps[2]).toBeLessThan(gaps[1] / 5);
    expect(gaps[2]).toBeLessThan(0.1);
  });
});

describe('sampled loops against numpy/scipy (fixtures/discrete/discretisations.json)', () => {
  const fixture = discretisationFixture();
  for (const loop of fixture.loops) {
    it(loop.name, () => {
      const body = loop.body as unknown as {
        plant: { numerator: number[]; denominator: number[] };
        controller: PidController & { implementation: { samplePeriod: number; method: 'tustin'; prewarpFrequency?: number; computationDelay?: number } };
      };
      const impl = body.controller.implementation;
      const plant = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', ...body.plant }), impl.samplePeriod, impl.computationDelay ?? 0);
      const controller = discretePidModel(pidModel(body.controller), impl);
      const r = analyzeSampledLoop(discreteProduct(controller, plant), options);
      const e = loop.expected;
      const magnitudes = r.stability.closedLoopPoles!.map((p) => Math.hypot(p.re, p.im));
      expect(magnitudes).toHaveLength(e.closedLoopPoleMagnitudes.length);
      magnitudes.forEach((m, i) => expect(m).toBeCloseTo(e.closedLoopPoleMagnitudes[i], 9));
      const unstable = e.closedLoopPoleMagnitudes.filter((m) => m >= 1).length;
      expect(r.stability.closedLoopStable).toBe(unstable === 0);
      expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(unstable);
      expect(r.margins.gainCrossovers).toHaveLength(e.gainCrossovers.length);
      r.margins.gainCrossovers.forEach((g, i) => {
        expect(g.frequency / e.gainCrossovers[i].frequency - 1).toBeLessThan(1e-9);
        expect(g.phaseMarginDegrees).toBeCloseTo(e.gainCrossovers[i].phaseMarginDegrees, 7);
      });
      // Phase crossovers with a gain margin above 60 dB are not listed (NEGLIGIBLE_LOOP_GAIN).
      const listed = e.phaseCrossovers.filter((p) => p.ratio <= 1000).sort((x, y) => Math.abs(Math.log(x.ratio)) - Math.abs(Math.log(y.ratio)));
      expect(r.margins.phaseCrossovers).toHaveLength(listed.length);
      r.margins.phaseCrossovers.forEach((p, i) => {
        expect(Math.abs(p.frequency / listed[i].frequency - 1)).toBeLessThan(1e-9);
        expect(Math.abs(p.ratio / listed[i].ratio - 1)).toBeLessThan(1e-9);
      });
      // The fixture's peak is a maximum over a dense grid: a lower bound, close to the refined one.
      expect(r.peaks.sensitivity.value).toBeGreaterThanOrEqual(e.sensitivityPeakOnGrid * (1 - 1e-12));
      expect(r.peaks.sensitivity.value / e.sensitivityPeakOnGrid - 1).toBeLessThan(1e-6);
    });
  }
});

describe('long sample delays: Nyquist alone', () => {
  it('k·z^(−150)/(z − a): no roots are computed, and the unit-circle count matches the roots of z^151 − a·z^150 + k', () => {
    const a = 0.9;
    for (const k of [0.05, 0.11, 0.3]) {
      const loop = discretePlantModel({ kind: 'zeros-poles', variable: 'z', samplePeriod: 0.1, zeros: [], poles: [a], gain: k, delay: 15 } as never);
      const r = analyzeSampledLoop(loop, options);
      expect(r.stability.method).toBe('unit-circle-nyquist');
      expect(r.stability.closedLoopPoles).toBeUndefined();
      const characteristic = [1, -a, ...new Array(149).fill(0), k];
      const outside = polynomialRoots(characteristic).filter((q) => Math.hypot(q.re, q.im) >= 1).length;
      expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(outside);
    }
  });
});
