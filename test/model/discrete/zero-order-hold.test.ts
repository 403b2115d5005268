/**
 * The sample-and-hold equivalent against
 *  - the closed form for a first-order lag K/(τs + 1): a = e^{−Ts/τ},
 *    G(z) = K(1 − a)/(z − a) (Åström & Wittenmark, Computer-Controlled
 *    Systems, 3rd ed., §2.3), and with a fractional delay T = d·Ts + θ the
 *    modified z-transform K·z^{−d−1}·((1 − e^{−(Ts−θ)/τ})z + e^{−(Ts−θ)/τ} − a)/(z − a)
 *    (Franklin, Powell & Workman, Digital Control of Dynamic Systems, §4.4; derivation);
 *  - scipy.signal.cont2discrete(method='zoh') for delay-free plants;
 *  - pulse responses from the definition h_k = g(kTs − T) − g((k−1)Ts − T)
 *    computed with mpmath (fixtures/discrete/discretisations.json) for plants
 *    with delays that are not whole samples.
 */
import { describe, expect, it } from 'vitest';
import { heldPlantModel } from '../../../src/model/discrete/sampled-plant.js';
import { splitDelay } from '../../../src/model/discrete/zero-order-hold.js';
import { transferFunctionModel } from '../../../src/model/plants/transfer-function.js';
import { zerosPolesModel } from '../../../src/model/plants/zeros-poles.js';
import type { ZerosPolesPlant } from '../../../src/model/plant-description.js';
import { discretisationFixture, impulseResponse, normalised } from './fixture.js';

const fixture = discretisationFixture();

describe('zero-order-hold equivalent, closed forms', () => {
  it('first-order lag K/(τs + 1): b/(z − a) with a = e^{−Ts/τ}, b = K(1 − a)', () => {
    for (const [k, tau, ts] of [[2, 3, 0.5], [0.7, 0.01, 0.05], [5, 100, 1e-3]]) {
      const g = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator: [k], denominator: [tau, 1] }), ts);
      const a = Math.exp(-ts / tau);
      const n = normalised(g.discrete.numerator, g.discrete.denominator);
      expect(n.denominator).toHaveLength(2);
      expect(n.numerator).toHaveLength(1);
      expect(Math.abs(n.denominator[1] + a)).toBeLessThan(1e-14);
      expect(Math.abs(n.numerator[0] - k * -Math.expm1(-ts / tau)) / (k * -Math.expm1(-ts / tau))).toBeLessThan(1e-12);
      expect(g.discrete.delaySamples).toBe(0);
      // The pole offset z − 1 keeps full relative accuracy under fast sampling.
      const w = 1 / (100 * ts);
      const v = g.evaluate(w, { re: 0, im: 0 });
      const theta = w * ts;
      const exact = { re: Math.cos(theta) - a, im: Math.sin(theta) };
      const bb = exact.re ** 2 + exact.im ** 2;
      const b = k * -Math.expm1(-ts / tau);
      expect(Math.hypot(v.re - (b * exact.re) / bb, v.im + (b * exact.im) / bb) / (b / Math.sqrt(bb))).toBeLessThan(1e-10);
    }
  });

  it('first-order lag with a delay of 1.6 samples: the modified z-transform', () => {
    const k = 2;
    const tau = 3;
    const ts = 0.5;
    const delay = 0.8; // d = 1, θ = 0.3
    const g = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator: [k], denominator: [tau, 1], delay }), ts);
    const a = Math.exp(-ts / tau);
    const e = Math.exp(-(ts - 0.3) / tau);
    expect(g.discrete.delaySamples).toBe(1);
    const n = normalised(g.discrete.numerator, g.discrete.denominator);
    // denominator z(z − a) = z² − a z
    expect(n.denominator[0]).toBe(1);
    expect(n.denominator[1]).toBeCloseTo(-a, 14);
    expect(Math.abs(n.denominator[2])).toBeLessThan(1e-15);
    expect(n.numerator[0]).toBeCloseTo(k * (1 - e), 13);
    expect(n.numerator[1]).toBeCloseTo(k * (e - a), 13);
  });

  it('splits delays into whole samples and a remainder, snapping remainders at rounding level', () => {
    expect(splitDelay(0.3, 0.1)).toEqual({ samples: 3, fraction: 0 });
    expect(splitDelay(0.8, 0.5).samples).toBe(1);
    expect(splitDelay(0.8, 0.5).fraction).toBeCloseTo(0.3, 15);
    expect(splitDelay(0, 0.5)).toEqual({ samples: 0, fraction: 0 });
  });
});

describe('zero-order-hold equivalent against scipy.signal.cont2discrete (zoh)', () => {
  for (const p of fixture.holdPlants) {
    it(p.name, () => {
      const g = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator: p.numerator, denominator: p.denominator }), p.samplePeriod);
      const got = normalised(g.discrete.numerator, g.discrete.denominator);
      expect(got.denominator).toHaveLength(p.expected.denominator.length);
      expect(got.numerator).toHaveLength(p.expected.numerator.length);
      got.denominator.forEach((x, i) => expect(Math.abs(x - p.expected.denominator[i])).toBeLessThan(1e-12 * Math.max(1, Math.abs(p.expected.denominator[i]))));
      const scale = Math.max(...p.expected.numerator.map(Math.abs));
      got.numerator.forEach((x, i) => expect(Math.abs(x - p.expected.numerator[i])).toBeLessThan(1e-9 * scale));
      // A held step settles where the continuous one does: G(1) = P(0) (step invariance, derivation).
      const dc = p.numerator[p.numerator.length - 1] / p.denominator[p.denominator.length - 1];
      if (g.integrators === 0) expect(Math.abs(g.lowFrequencyGain - dc) / Math.abs(dc)).toBeLessThan(1e-12);
    });
  }
});

describe('zero-order-hold equivalent: pulse responses with fractional delays (mpmath, from the definition)', () => {
  for (const p of fixture.pulses) {
    it(p.name, () => {
      const g = heldPlantModel(zerosPolesModel(p.plant as ZerosPolesPlant), p.samplePeriod);
      const h = impulseResponse(g.discrete.numerator, g.discrete.denominator, g.discrete.delaySamples, p.pulseResponse.length);
      const scale = Math.max(...p.pulseResponse.map(Math.abs));
      h.forEach((x, k) => expect(Math.abs(x - p.pulseResponse[k]), `sample ${k}`).toBeLessThan(1e-11 * scale));
    });
  }
});
