/**
 * The unit-circle Nyquist count against the closed-loop roots in z
 * (Åström & Wittenmark, Computer-Controlled Systems, §3.2–3.3: Z = N + P on
 * the unit circle must equal the number of roots outside it), including the
 * arcs round open-loop poles at z = 1 (integrators) and z = −1 (Tustin's image
 * of an unfiltered derivative), and open-loop poles outside the circle.
 */
import { describe, expect, it } from 'vitest';
import { analyzeSampledLoop } from '../../../src/analysis/sampled/analyze-sampled-loop.js';
import { DEFAULT_CRITERIA } from '../../../src/analysis/criteria.js';
import { discretePidModel } from '../../../src/model/discrete/discrete-pid.js';
import { discreteProduct } from '../../../src/model/discrete/discrete-product.js';
import { discretePlantModel } from '../../../src/model/discrete/discrete-plant.js';
import { heldPlantModel } from '../../../src/model/discrete/sampled-plant.js';
import { pidModel } from '../../../src/model/pid.js';
import type { PidController } from '../../../src/model/plant-description.js';
import { transferFunctionModel } from '../../../src/model/plants/transfer-function.js';

const options = { criteria: DEFAULT_CRITERIA, includeResponse: false };

type Method = 'tustin' | 'backward-euler' | 'forward-euler';

function agreement(controller: PidController, numerator: number[], denominator: number[], ts: number, method: Method, computationDelay = 0) {
  const plant = heldPlantModel(transferFunctionModel({ kind: 'transfer-function', numerator, denominator }), ts, computationDelay);
  const c = discretePidModel(pidModel(controller), { samplePeriod: ts, method });
  const r = analyzeSampledLoop(discreteProduct(c, plant), options);
  const outside = r.stability.closedLoopPoles!.filter((p) => Math.hypot(p.re, p.im) >= 1).length;
  return { r, outside };
}

describe('unit-circle Nyquist agrees with the roots in z', () => {
  const cases: [string, PidController, number[], number[], number, Method, number?][] = [
    ['PI on a lag (pole at z = 1)', { kind: 'pid', form: 'parallel', kp: 2, ki: 3 }, [1], [0.5, 1], 0.05, 'tustin'],
    ['PI on a lag, too slow a sample rate', { kind: 'pid', form: 'parallel', kp: 6, ki: 3 }, [1], [0.5, 1], 0.3, 'tustin'],
    ['PI on an integrating plant (double pole at z = 1)', { kind: 'pid', form: 'parallel', kp: 0.8, ki: 0.1 }, [1], [2, 1, 0], 0.1, 'backward-euler'],
    // Tustin's pole at z = −1 for an unfiltered derivative: the ringing mode leaves the circle when P(−1) > 0 ...
    ['unfiltered PD by Tustin (pole at z = −1)', { kind: 'pid', form: 'parallel', kp: 1, kd: 0.05 }, [4], [1, 3, 2], 0.05, 'tustin'],
    // ... and stays inside when a sample of computation delay turns the sign of P(−1).
    ['unfiltered PD by Tustin, one sample of computation delay', { kind: 'pid', form: 'parallel', kp: 1, kd: 0.05 }, [4], [1, 3, 2], 0.05, 'tustin', 0.05],
    ['open-loop unstable plant stabilised', { kind: 'pid', form: 'parallel', kp: 3, ki: 0.5 }, [1], [1, -1], 0.02, 'tustin'],
    ['open-loop unstable plant, too little gain', { kind: 'pid', form: 'parallel', kp: 0.5 }, [1], [1, -1], 0.02, 'tustin'],
    ['forward Euler puts a controller pole outside the circle', { kind: 'pid', form: 'parallel', kp: 1.5, kd: 0.2, derivativeFilter: { timeConstant: 0.05 } }, [1], [1, 1], 0.2, 'forward-euler'],
  ];
  for (const [name, c, num, den, ts, method, delay] of cases) {
    it(name, () => {
      const { r, outside } = agreement(c, num, den, ts, method, delay);
      expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(outside);
      expect(r.stability.closedLoopStable).toBe(outside === 0);
      expect(r.warnings.map((w) => w.code)).not.toContain('stability_methods_disagree');
    });
  }

  it('counts the open-loop poles outside the circle and at z = ±1', () => {
    const unstable = agreement({ kind: 'pid', form: 'parallel', kp: 3, ki: 0.5 }, [1], [1, -1], 0.02, 'tustin').r.stability;
    expect(unstable.openLoopUnstablePoles).toBe(1);
    expect(unstable.integrators).toBe(1);
    const tustinPd = agreement({ kind: 'pid', form: 'parallel', kp: 1, kd: 0.05 }, [4], [1, 3, 2], 0.05, 'tustin').r.stability;
    expect(tustinPd.unitCirclePoles).toEqual([{ frequency: Math.PI / 0.05, order: 1 }]);
  });

  it('a discrete plant given in z: double integrator 1/(z − 1)² with a lead controller written as a plant', () => {
    // L(z) = k·(z − 0.8)/((z − 1)²·(z − 0.2)) (a loop given directly, no controller): roots decide.
    for (const k of [0.05, 0.5, 3]) {
      const loop = discretePlantModel({ kind: 'zeros-poles', zeros: [0.8], poles: [1, 1, 0.2], gain: k, samplePeriod: 0.1 });
      const r = analyzeSampledLoop(loop, options);
      const outside = r.stability.closedLoopPoles!.filter((p) => Math.hypot(p.re, p.im) >= 1).length;
      expect(r.stability.integrators).toBe(2);
      expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(outside);
    }
  });
});
