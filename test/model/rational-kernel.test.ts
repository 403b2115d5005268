import { describe, expect, it } from 'vitest';
import { integerPower, rationalKernel } from '../../src/model/rational-kernel.js';
import { productModel } from '../../src/model/loop.js';
import { rationalModel } from '../../src/model/rational-model.js';

describe('integerPower', () => {
  it('agrees with Math.pow to within |k| rounding errors, including negative bases and k = 0', () => {
    for (const x of [-3.7, -1.5, 1.0001, 2, 17.25, 1e3, 6.02e23]) {
      for (let k = -12; k <= 12; k++) {
        const expected = Math.pow(x, k);
        const got = integerPower(x, k);
        expect(Math.abs(got - expected)).toBeLessThanOrEqual(Math.max(1, Math.abs(k)) * 2.3e-16 * Math.abs(expected));
      }
    }
    expect(integerPower(5, 0)).toBe(1);
  });

  it('falls back to Math.pow where the product leaves the range of a double', () => {
    // 1e200^2 overflows, but 1e200^-2 = 1e-400 underflows to 0 either way; 1e155^-2 = 1e-310 is subnormal.
    expect(integerPower(1e155, -2)).toBe(Math.pow(1e155, -2));
    expect(integerPower(1e155, -2)).toBeGreaterThan(0);
    expect(integerPower(1e200, 2)).toBe(Infinity);
  });
});

/** Frequencies on both sides of ω = 1, where the kernel switches to reversed coefficients. */
const OMEGAS = [1e-4, 0.03, 0.5, 1, 1.7, 20, 3e3, 1e8];

describe('rationalKernel', () => {
  it('matches the closed form of K/(s(s + 1)(s + 2))·e^{−sT} evaluated factor by factor (Ogata, Modern Control Engineering, the type-1 third-order example)', () => {
    const K = 4;
    const T = 0.3;
    const kernel = rationalKernel({ factors: [{ numerator: [K], denominator: [1, 0] }, { numerator: [1], denominator: [1, 1] }, { numerator: [1], denominator: [1, 2] }], delay: T });
    const v = { re: 0, im: 0 };
    for (const w of OMEGAS) {
      kernel.evaluate(w, v);
      // |L| = K/(ω·√(ω² + 1)·√(ω² + 4)), ∠L = −90° − atan ω − atan(ω/2) − ωT; the delay's turn is applied
      // as cos ωT − j·sin ωT, since at ω = 1e8 a sum of angles would lose ulp(ωT) ≈ 4e-9 rad.
      const magnitude = K / (w * Math.sqrt(w * w + 1) * Math.sqrt(w * w + 4));
      const phase = -Math.PI / 2 - Math.atan(w) - Math.atan(w / 2);
      const [ar, ai] = [magnitude * Math.cos(phase), magnitude * Math.sin(phase)];
      const [c, s] = [Math.cos(w * T), -Math.sin(w * T)];
      expect(Math.abs(v.re - (ar * c - ai * s))).toBeLessThan(1e-14 * magnitude);
      expect(Math.abs(v.im - (ar * s + ai * c))).toBeLessThan(1e-14 * magnitude);
    }
  });

  it('applies the net power of all factors once, so powers of opposite factors cancel before they overflow', () => {
    // s³ · 1/(s + 1)³ at ω = 1e150: (jω)³ alone is 1e450 (not a double), but the product is (jω/(jω + 1))³ ≈ 1.
    const kernel = rationalKernel({ factors: [{ numerator: [1, 0, 0, 0], denominator: [1] }, { numerator: [1], denominator: [1, 3, 3, 1] }], delay: 0 });
    for (const w of [1e150, 1e300]) {
      const v = kernel.evaluate(w, { re: 0, im: 0 });
      // jω/(jω + 1) = (ω² + jω)/(ω² + 1): real part 1 − 1/ω² + …, imaginary part about 1/ω; cubed, 1 + 3j/ω to first order.
      expect(v.re).toBeCloseTo(1, 15);
      expect(Math.abs(v.im - 3 / w)).toBeLessThan(1e-15 * (3 / w));
    }
  });

  it('applies the powers early where the running product would leave the range of a double', () => {
    // 1e200/(s + 1) · 1e200/(s + 1) at ω = 1e100: each quotient in 1/(jω) is about 1e200, their product
    // 1e400 is not a double, but L = 1e400/(jω + 1)² ≈ −1e400/ω² − 2j·1e400/ω³ = −1e200 − 2e100·j is.
    const kernel = rationalKernel({ factors: [{ numerator: [1e200], denominator: [1, 1] }, { numerator: [1e200], denominator: [1, 1] }], delay: 0 });
    const v = kernel.evaluate(1e100, { re: 0, im: 0 });
    expect(Math.abs(v.re / -1e200 - 1)).toBeLessThan(1e-15);
    expect(Math.abs(v.im / -2e100 - 1)).toBeLessThan(1e-15);
  });

  it('gives every point of a batch exactly the value of a single evaluation', () => {
    const kernel = rationalKernel({ factors: [{ numerator: [1.8], denominator: [2090, 117, 1] }, { numerator: [460.1, 12.3, 0.02], denominator: [20.9, 95, 0] }], delay: 14 });
    const omega = Float64Array.from({ length: 61 }, (_, k) => 1e-3 * 10 ** (k / 8.5));
    const re = new Float64Array(omega.length);
    const im = new Float64Array(omega.length);
    kernel.evaluateBatch(omega, re, im, omega.length);
    omega.forEach((w, k) => {
      const v = kernel.evaluate(w, { re: 0, im: 0 });
      expect([re[k], im[k]]).toEqual([v.re, v.im]);
    });
  });
});

describe('productModel with coefficient-form factors', () => {
  const plant = rationalModel([1.8], [2090, 117, 1], 14);
  const controller = rationalModel([460.1, 12.3, 0.02], [20.9, 95, 0], 0);
  const factored = rationalModel([2, 6], [1, 3, 2], 0.1, { factored: { gain: 2, zeros: [{ re: -3, im: 0 }], poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }] } });

  it('fuses two coefficient-form models into one kernel, and keeps a factored model apart', () => {
    expect(productModel(plant, controller).rationalFactors?.factors).toHaveLength(2);
    expect(productModel(plant, controller).rationalFactors?.delay).toBe(14);
    expect(productModel(productModel(plant, controller), plant).rationalFactors?.factors).toHaveLength(3);
    expect(productModel(factored, plant).rationalFactors).toBeUndefined();
  });

  it('agrees with the product of the factors evaluated one by one, to rounding', () => {
    const loop = productModel(plant, controller);
    for (const w of OMEGAS) {
      const p = plant.evaluate(w, { re: 0, im: 0 });
      const c = controller.evaluate(w, { re: 0, im: 0 });
      const expected = { re: p.re * c.re - p.im * c.im, im: p.re * c.im + p.im * c.re };
      const v = loop.evaluate(w, { re: 0, im: 0 });
      const scale = Math.hypot(expected.re, expected.im);
      expect(Math.hypot(v.re - expected.re, v.im - expected.im)).toBeLessThan(1e-14 * scale);
    }
  });
});
