/**
 * A matrix with NaN or ±∞ entries reached a routine that cannot work on it:
 * the loop's state-space realisation overflowed (coefficients too large or
 * too far apart). Thrown as its own type so callers refuse the request
 * without matching message text.
 */
export class NonFiniteMatrixError extends Error {
  constructor(routine: string) {
    super(`${routine}: non-finite matrix entry`);
    this.name = 'NonFiniteMatrixError';
  }
}
