import { describe, expect, it } from 'vitest';
import { realFftOfSize } from '../../src/estimation/real-fft.js';

function directDft(x: Float64Array, k: number): [number, number] {
  let re = 0;
  let im = 0;
  for (let i = 0; i < x.length; i++) {
    const a = (-2 * Math.PI * ((k * i) % x.length)) / x.length;
    re += x[i] * Math.cos(a);
    im += x[i] * Math.sin(a);
  }
  return [re, im];
}

describe('realFftOfSize (fft.js real transform, sign convention e^{−j2πki/n})', () => {
  it('cos at bin m gives n/2 at bin m; sin gives −j·n/2 (closed form)', () => {
    const n = 64;
    const m = 5;
    const fft = realFftOfSize(n);
    const out = new Float64Array(2 * n);
    fft.transform(Float64Array.from({ length: n }, (_, i) => Math.cos((2 * Math.PI * m * i) / n)), out);
    expect(out[2 * m]).toBeCloseTo(n / 2, 12);
    expect(out[2 * m + 1]).toBeCloseTo(0, 12);
    expect(out[2 * (m + 1)]).toBeCloseTo(0, 12);
    fft.transform(Float64Array.from({ length: n }, (_, i) => Math.sin((2 * Math.PI * m * i) / n)), out);
    expect(out[2 * m]).toBeCloseTo(0, 12);
    expect(out[2 * m + 1]).toBeCloseTo(-n / 2, 12);
  });

  it('fills bins 0..n/2 like the defining sum, for every size from 8 to 4096', () => {
    for (let n = 8; n <= 4096; n *= 2) {
      const x = Float64Array.from({ length: n }, (_, i) => Math.sin(0.7 * i * i) + 0.3);
      const out = new Float64Array(2 * n);
      realFftOfSize(n).transform(x, out);
      for (const k of [0, 1, n / 4 + 1, n / 2 - 1, n / 2]) {
        const [re, im] = directDft(x, k);
        expect(Math.abs(out[2 * k] - re), `n=${n} k=${k}`).toBeLessThan(1e-10 * n);
        expect(Math.abs(out[2 * k + 1] - im), `n=${n} k=${k}`).toBeLessThan(1e-10 * n);
      }
    }
  });

  it('hands out one transform per size', () => {
    expect(realFftOfSize(256)).toBe(realFftOfSize(256));
  });
});
