/**
 * The sampler-and-hold response against its definition
 * (1 − e^{−jωTs})/(jωTs)·e^{−jωd} (derivation: a pulse of width Ts over Ts),
 * with its phase lag ω(Ts/2 + d) and zeros at multiples of 2π/Ts.
 */
import { describe, expect, it } from 'vitest';
import { holdResponseModel } from '../../../src/model/discrete/hold-response.js';

describe('holdResponseModel', () => {
  it('equals (1 − e^{−jωTs})/(jωTs)·e^{−jωd}', () => {
    const ts = 0.1;
    const d = 0.03;
    const h = holdResponseModel(ts, d);
    for (const w of [0.01, 1, 7, 31, 62]) {
      // (1 − e^{−jx})/(jx) with x = ωTs
      const x = w * ts;
      const nr = 1 - Math.cos(x);
      const ni = Math.sin(x);
      // divide by jx: (nr + j ni)/(j x) = ni/x − j nr/x
      const br = ni / x;
      const bi = -nr / x;
      const er = br * Math.cos(w * d) + bi * Math.sin(w * d);
      const ei = bi * Math.cos(w * d) - br * Math.sin(w * d);
      const v = h.evaluate(w, { re: 0, im: 0 });
      // The definition itself loses digits to 1 − cos x at small x: compare relatively.
      expect(Math.hypot(v.re - er, v.im - ei) / Math.hypot(er, ei)).toBeLessThan(1e-9);
    }
    expect(Math.hypot(h.evaluate((2 * Math.PI) / ts, { re: 0, im: 0 }).re)).toBeLessThan(1e-15);
    expect(h.evaluate(0, { re: 0, im: 0 })).toEqual({ re: 1, im: -0 });
  });
});
