/**
 * e^x − 1 and ln(1 + x) for complex x without cancellation near x = 0,
 * built on the real expm1/log1p (W. Kahan's device: write the small part
 * explicitly, e.g. cos y − 1 = −2·sin²(y/2)).
 *
 * They matter for sampled systems: a pole at s = p becomes z = e^{pTs}, and
 * for fast sampling z − 1 = e^{pTs} − 1 is tiny; computing it as
 * exp(pTs) − 1 would lose most of its digits.
 *
 * @example complexExpm1({re: 0, im: 1e-9}) // ≈ {re: −5e−19, im: 1e−9}
 */
import type { Complex } from './complex.js';

export function complexExpm1(x: Complex): Complex {
  const em1 = Math.expm1(x.re);
  const s = Math.sin(x.im / 2);
  // e^a·cos b − 1 = (e^a − 1)·cos b + (cos b − 1)
  return { re: em1 * Math.cos(x.im) - 2 * s * s, im: (em1 + 1) * Math.sin(x.im) };
}

export function complexLog1p(x: Complex): Complex {
  // |1 + x|² − 1 = 2·x_re + x_re² + x_im²
  const t = x.re * (2 + x.re) + x.im * x.im;
  return { re: 0.5 * Math.log1p(t), im: Math.atan2(x.im, 1 + x.re) };
}
