/**
 * Elementary functions of a complex argument on principal branches
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, §4.2–4.5),
 * for the expression plant kind.
 */
import type { Complex } from './complex.js';

export const cexp = (z: Complex): Complex => {
  const m = Math.exp(z.re);
  return { re: m * Math.cos(z.im), im: m * Math.sin(z.im) };
};

export const clog = (z: Complex): Complex => ({ re: Math.log(Math.hypot(z.re, z.im)), im: Math.atan2(z.im, z.re) });

/** Principal square root, computed without cancellation (Kahan's formulation). */
export function csqrt(z: Complex): Complex {
  const m = Math.hypot(z.re, z.im);
  if (m === 0) return { re: 0, im: 0 };
  const t = Math.sqrt((m + Math.abs(z.re)) / 2);
  if (z.re >= 0) return { re: t, im: z.im / (2 * t) };
  return { re: Math.abs(z.im) / (2 * t), im: z.im >= 0 ? t : -t };
}

export const csinh = (z: Complex): Complex => ({ re: Math.sinh(z.re) * Math.cos(z.im), im: Math.cosh(z.re) * Math.sin(z.im) });
export const ccosh = (z: Complex): Complex => ({ re: Math.cosh(z.re) * Math.cos(z.im), im: Math.sinh(z.re) * Math.sin(z.im) });
export const csin = (z: Complex): Complex => ({ re: Math.sin(z.re) * Math.cosh(z.im), im: Math.cos(z.re) * Math.sinh(z.im) });
export const ccos = (z: Complex): Complex => ({ re: Math.cos(z.re) * Math.cosh(z.im), im: -Math.sin(z.re) * Math.sinh(z.im) });

export function ctanh(z: Complex): Complex {
  // tanh(x + jy) = (sinh 2x + j sin 2y) / (cosh 2x + cos 2y)
  if (Math.abs(z.re) > 20) return { re: Math.sign(z.re), im: 0 };
  const d = Math.cosh(2 * z.re) + Math.cos(2 * z.im);
  return { re: Math.sinh(2 * z.re) / d, im: Math.sin(2 * z.im) / d };
}

/** z^k for an integer k by binary powering (exact branch, no logarithm). */
export function cpowInteger(z: Complex, k: number): Complex {
  let n = Math.abs(k);
  let rr = 1;
  let ri = 0;
  let br = z.re;
  let bi = z.im;
  while (n > 0) {
    if (n & 1) {
      const t = rr * br - ri * bi;
      ri = rr * bi + ri * br;
      rr = t;
    }
    const t = br * br - bi * bi;
    bi = 2 * br * bi;
    br = t;
    n >>>= 1;
  }
  if (k < 0) {
    const d = rr * rr + ri * ri;
    return { re: rr / d, im: -ri / d };
  }
  return { re: rr, im: ri };
}

/** General power a^b = exp(b·log a) on the principal branch; 0^b = 0 for Re b > 0. */
export function cpow(a: Complex, b: Complex): Complex {
  if (b.im === 0 && Number.isInteger(b.re) && Math.abs(b.re) <= 1024) return cpowInteger(a, b.re);
  if (a.re === 0 && a.im === 0) return b.re > 0 ? { re: 0, im: 0 } : { re: NaN, im: NaN };
  const l = clog(a);
  return cexp({ re: b.re * l.re - b.im * l.im, im: b.re * l.im + b.im * l.re });
}
