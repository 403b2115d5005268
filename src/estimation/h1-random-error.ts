/** Random error of an H1 estimate at one bin (see `h1RandomError`). */
export interface H1RandomError {
  /** Standard deviation of |H1| divided by |H|. */
  magnitudeRelative: number;
  /** Standard deviation of the phase of H1, radians. */
  phaseStdRad: number;
}

/**
 * Normalised random error of an H1 frequency-response estimate at one bin:
 *
 *   ε(|H|) ≈ √(1 − γ²) / (|γ|·√(2·nd)),   σ(phase) ≈ ε(|H|) radians,
 *
 * with γ² the magnitude-squared coherence and nd the number of averages
 * (J. S. Bendat, A. G. Piersol, Random Data, 4th ed., Wiley 2010, chapter on
 * frequency-response estimation — both expressions *(from memory; check the
 * book before relying on the constant)*). The formulas are first-order in
 * the error, so read them as meaningful where ε is below about 0.2.
 *
 * A derivation for Gaussian input and output noise gives nd − 1 in place of
 * nd (the H1 error is Σ conj(U)·N / Σ|U|² and E[1/Σ|U|²] = 1/((nd−1)·Guu)),
 * which the large-nd formula rounds away; overlapping segments (Welch, 1967)
 * are not fully independent, so with 50 % overlap the true error is a few
 * per cent larger than this value.
 *
 * Returns Infinity for γ² = 0 (nothing of the output is explained by the
 * input) and 0 for γ² = 1.
 *
 * @example
 * h1RandomError(0.9, 15).magnitudeRelative // ≈ 0.0609: about ±6 % in |H|, ±3.5° in phase
 */
export function h1RandomError(coherence: number, averages: number): H1RandomError {
  if (!(coherence >= 0 && coherence <= 1)) {
    throw new RangeError(`coherence must be a magnitude-squared coherence in [0, 1]; got ${coherence}.`);
  }
  if (!(Number.isInteger(averages) && averages >= 1)) {
    throw new RangeError(`averages must be a whole number of averaged segments ≥ 1; got ${averages}.`);
  }
  const relative = coherence === 0 ? Infinity : Math.sqrt(1 - coherence) / (Math.sqrt(coherence) * Math.sqrt(2 * averages));
  return { magnitudeRelative: relative, phaseStdRad: relative };
}
