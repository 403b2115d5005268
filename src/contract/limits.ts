/** Size limits of a request (beyond them: 413). */
export const LIMITS = {
  maxGridPoints: 20_000,
  maxPolynomialDegree: 60,
  maxStates: 60,
  maxRoots: 60,
  maxExpressionLength: 4_000,
  maxBodyBytes: 1024 * 1024,
} as const;
