/**
 * Real polynomials as coefficient arrays in descending powers:
 * `[a0, a1, ..., an]` is a0·s^n + a1·s^(n-1) + ... + an.
 */
import type { Complex } from './complex.js';

export type Polynomial = readonly number[];

/** Drops leading zero coefficients; the zero polynomial becomes `[0]`. */
export function trimLeading(p: Polynomial): number[] {
  let i = 0;
  while (i < p.length - 1 && p[i] === 0) i++;
  return p.slice(i);
}

export const degree = (p: Polynomial): number => trimLeading(p).length - 1;

export const isZeroPolynomial = (p: Polynomial): boolean => p.every((c) => c === 0);

/** Product of two polynomials (discrete convolution of the coefficients). */
export function multiply(a: Polynomial, b: Polynomial): number[] {
  const out = new Array<number>(a.length + b.length - 1).fill(0);
  for (let i = 0; i < a.length; i++) for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
  return out;
}

/** Sum of two polynomials, aligned at the constant term. */
export function addPolynomials(a: Polynomial, b: Polynomial): number[] {
  const n = Math.max(a.length, b.length);
  const out = new Array<number>(n).fill(0);
  for (let i = 0; i < a.length; i++) out[n - a.length + i] += a[i];
  for (let i = 0; i < b.length; i++) out[n - b.length + i] += b[i];
  return out;
}

/** Monic-free product Π(s − r) over real and conjugate-paired complex roots, times `gain`. */
export function fromRoots(roots: readonly Complex[], gain = 1): number[] {
  // Multiply in complex arithmetic, then keep the real part: conjugate pairs
  // make the imaginary parts vanish up to rounding.
  let re = [1];
  let im = [0];
  for (const r of roots) {
    const nre = new Array<number>(re.length + 1).fill(0);
    const nim = new Array<number>(re.length + 1).fill(0);
    for (let i = 0; i < re.length; i++) {
      nre[i] += re[i];
      nim[i] += im[i];
      nre[i + 1] -= re[i] * r.re - im[i] * r.im;
      nim[i + 1] -= re[i] * r.im + im[i] * r.re;
    }
    re = nre;
    im = nim;
  }
  return re.map((c) => c * gain);
}

/**
 * Value of p at s = jω by Horner's rule in complex arithmetic, specialised to
 * a purely imaginary argument: (x + jy)·jω = −yω + jxω.
 */
export function evaluateAtImaginary(p: Polynomial, omega: number, out: Complex): Complex {
  let re = 0;
  let im = 0;
  for (let i = 0; i < p.length; i++) {
    const nre = -im * omega + p[i];
    im = re * omega;
    re = nre;
  }
  out.re = re;
  out.im = im;
  return out;
}

/** Value of p at a complex point by Horner's rule. */
export function evaluateAt(p: Polynomial, s: Complex): Complex {
  let re = 0;
  let im = 0;
  for (let i = 0; i < p.length; i++) {
    const nre = re * s.re - im * s.im + p[i];
    im = re * s.im + im * s.re;
    re = nre;
  }
  return { re, im };
}

/** Number of trailing zero coefficients: the multiplicity of the root at s = 0. */
export function zeroRootMultiplicity(p: Polynomial): number {
  let k = 0;
  for (let i = p.length - 1; i > 0 && p[i] === 0; i--) k++;
  return k;
}

/** Removes `k` roots at the origin (drops trailing zero coefficients). */
export const deflateZeroRoots = (p: Polynomial, k: number): number[] => p.slice(0, p.length - k);
