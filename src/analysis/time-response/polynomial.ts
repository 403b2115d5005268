/**
 * Polynomial helpers on real coefficient arrays in descending powers of s
 * (the convention of the loop description: [a0, a1, a2] is a0 s² + a1 s + a2).
 */

/** Drops leading zero coefficients; the zero polynomial becomes [0]. */
export function trimLeadingZeros(coefficients: readonly number[]): number[] {
  let first = 0;
  while (first < coefficients.length - 1 && coefficients[first] === 0) first++;
  const out = coefficients.slice(first);
  return out.length === 0 ? [0] : out;
}

export function isZeroPolynomial(coefficients: readonly number[]): boolean {
  return coefficients.every((c) => c === 0);
}

export function degreeOf(coefficients: readonly number[]): number {
  return trimLeadingZeros(coefficients).length - 1;
}

/** Product by direct convolution. */
export function multiplyPolynomials(a: readonly number[], b: readonly number[]): number[] {
  const out = new Array<number>(a.length + b.length - 1).fill(0);
  for (let i = 0; i < a.length; i++) for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
  return out;
}

/** Sum, aligning the constant terms. */
export function addPolynomials(a: readonly number[], b: readonly number[]): number[] {
  const n = Math.max(a.length, b.length);
  const out = new Array<number>(n).fill(0);
  for (let i = 0; i < a.length; i++) out[n - a.length + i] += a[i];
  for (let i = 0; i < b.length; i++) out[n - b.length + i] += b[i];
  return out;
}

/** Value at the complex point re + j·im by Horner's rule, as [re, im]. */
export function evaluatePolynomialComplex(
  coefficients: readonly number[],
  re: number,
  im: number,
): [number, number] {
  let pr = 0;
  let pi = 0;
  for (const c of coefficients) {
    const nr = pr * re - pi * im + c;
    const ni = pr * im + pi * re;
    pr = nr;
    pi = ni;
  }
  return [pr, pi];
}

/** Number of zero coefficients at the low end, i.e. the multiplicity of the root s = 0. */
export function rootsAtOriginCount(coefficients: readonly number[]): number {
  let count = 0;
  for (let i = coefficients.length - 1; i > 0 && coefficients[i] === 0; i--) count++;
  return count;
}

/** Lowest-order non-zero coefficient (0 for the zero polynomial). */
export function lowestNonZeroCoefficient(coefficients: readonly number[]): number {
  for (let i = coefficients.length - 1; i >= 0; i--) if (coefficients[i] !== 0) return coefficients[i];
  return 0;
}
