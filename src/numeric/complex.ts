/**
 * Complex numbers as plain `{re, im}` records. Hot loops work on pairs of
 * numbers directly; these helpers serve the code that runs once per root or
 * per crossing, where clarity beats the last nanosecond.
 */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});

/** Division by Smith's algorithm, which avoids overflow for large operands (Smith, CACM 5(8), 1962). */
export function div(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

export const abs = (a: Complex): number => Math.sqrt(a.re * a.re + a.im * a.im);
export const arg = (a: Complex): number => Math.atan2(a.im, a.re);
export const conj = (a: Complex): Complex => ({ re: a.re, im: -a.im });
export const scale = (a: Complex, k: number): Complex => ({ re: a.re * k, im: a.im * k });
