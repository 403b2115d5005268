import { describe, expect, it } from 'vitest';
import { evaluateAll } from '../../src/model/evaluate-all.js';
import { productModel } from '../../src/model/loop.js';
import { rationalModel } from '../../src/model/rational-model.js';
import { holdResponseModel } from '../../src/model/discrete/hold-response.js';
import type { FrequencyModel } from '../../src/model/frequency-model.js';

/** 61 frequencies from 1e-3 to 1e4 rad/s: both sides of ω = 1, where the rational evaluation changes form. */
const omega = Float64Array.from({ length: 61 }, (_, k) => 1e-3 * 10 ** (k / 8.5));

function pointByPoint(model: FrequencyModel): { re: number[]; im: number[] } {
  const v = { re: 0, im: 0 };
  const re: number[] = [];
  const im: number[] = [];
  for (const w of omega) {
    model.evaluate(w, v);
    re.push(v.re);
    im.push(v.im);
  }
  return { re, im };
}

function batched(model: FrequencyModel): { re: number[]; im: number[] } {
  const re = new Float64Array(omega.length);
  const im = new Float64Array(omega.length);
  evaluateAll(model, omega, re, im);
  return { re: Array.from(re), im: Array.from(im) };
}

describe('evaluateAll', () => {
  const plant = rationalModel([1.8], [2090, 117, 1], 14);
  const controller = rationalModel([460.1, 12.3, 0.02], [20.9, 95, 0], 0);
  const factored = rationalModel([2, 6], [1, 3, 2], 0.1, { factored: { gain: 2, zeros: [{ re: -3, im: 0 }], poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }] } });

  it('gives exactly the point-by-point values for coefficient, factored and product models', () => {
    for (const model of [plant, controller, factored, productModel(plant, controller), productModel(factored, plant)]) {
      expect(model.evaluateBatch).toBeTypeOf('function');
      expect(batched(model)).toEqual(pointByPoint(model));
    }
  });

  it('calls point by point a model that has no batch form, also inside a product', () => {
    const hold = holdResponseModel(0.5, 0.1);
    expect(hold.evaluateBatch).toBeUndefined();
    expect(batched(hold)).toEqual(pointByPoint(hold));
    expect(batched(productModel(plant, hold))).toEqual(pointByPoint(productModel(plant, hold)));
  });

  it('matches the closed form 2/(1 + jω)·e^{−0.1jω} of a product (controller 2, plant e^{−0.1s}/(s + 1))', () => {
    const loop = productModel(rationalModel([2], [1], 0), rationalModel([1], [1, 1], 0.1));
    const { re, im } = batched(loop);
    omega.forEach((w, k) => {
      const d = 1 + w * w;
      const ar = 2 / d;
      const ai = (-2 * w) / d;
      const c = Math.cos(0.1 * w);
      const s = -Math.sin(0.1 * w);
      const scale = 2 / Math.sqrt(d);
      expect(Math.abs(re[k] - (ar * c - ai * s))).toBeLessThan(1e-15 * scale + 1e-300);
      expect(Math.abs(im[k] - (ar * s + ai * c))).toBeLessThan(1e-15 * scale + 1e-300);
    });
  });
});
