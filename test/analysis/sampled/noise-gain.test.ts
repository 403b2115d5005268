/**
 * The RMS gain ‖C·S‖₂ against
 *  - the closed form for P control of a held first-order lag: C·S =
 *    kp·(z − a)/(z − p), p = a − kp·b, impulse response h0 = kp,
 *    h_k = −kp²·b·p^(k−1), so ‖C·S‖₂² = kp²·(1 + (kp·b)²/(1 − p²)) (derivation, Parseval);
 *  - √Σh_k² of the impulse response of C·S computed with scipy.signal.lfilter
 *    for the sampled loops of fixtures/discrete/discretisations.json.
 */
import { describe, expect, it } from 'vitest';
import { noiseGain } from '../../../src/analysis/sampled/noise-gain.js';
import { discretePidModel } from '../../../src/model/discrete/discrete-pid.js';
import { discreteProduct } from '../../../src/model/discrete/discrete-product.js';
import { heldPlantModel } from '../../../src/model/discrete/sampled-plant.js';
import { pidModel } from '../../../src/model/pid.js';
import type { PidController } from '../../../src/model/plant-description.js';
import { transferFunctionModel } from '../../../src/model/plants/transfer-function.js';
import { discretisationFixture } from '../../model/discrete/fixture.js';

describe('noiseGain', () => {
  it('P control of a held first-order lag: kp²·(1 + (kp·b)²/(1 − p²))', () => {
    const k = 2;
    const tau = 0.5;
    const ts = 0.25;
    const a = Math.exp(-ts / tau);
    const b = k * (1 - a);
    // Gains below the stability limit (1 + a)/(K(1 − a)) ≈ 2.04.
    for (const kp of [0.3, 1.5, 2.0]) {
      const plant = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator: [k], denominator: [tau, 1] }), ts);
      const controller = discretePidModel(pidModel({ kind: 'pid', form: 'parallel', kp }), { samplePeriod: ts, method: 'tustin' });
      const g = noiseGain(controller, discreteProduct(controller, plant), ts);
      const p = a - kp * b;
      expect(g.converged).toBe(true);
      expect(g.gain).toBeCloseTo(Math.sqrt(kp * kp * (1 + (kp * b) ** 2 / (1 - p * p))), 10);
    }
  });

  const fixture = discretisationFixture();
  for (const loop of fixture.loops.filter((l) => l.expected.noiseGain !== null)) {
    it(`${loop.name}: √Σh² of C·S (scipy lfilter)`, () => {
      const body = loop.body as unknown as {
        plant: { numerator: number[]; denominator: number[] };
        controller: PidController & { implementation: { samplePeriod: number; method: 'tustin'; prewarpFrequency?: number; computationDelay?: number } };
      };
      const impl = body.controller.implementation;
      const plant = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', ...body.plant }), impl.samplePeriod, impl.computationDelay ?? 0);
      const controller = discretePidModel(pidModel(body.controller), impl);
      const g = noiseGain(controller, discreteProduct(controller, plant), impl.samplePeriod);
      expect(g.converged).toBe(true);
      expect(Math.abs(g.gain / loop.expected.noiseGain! - 1)).toBeLessThan(1e-8);
    });
  }
});
