/** Stable codes for loops the time-response simulation cannot take. */
export type TimeResponseErrorCode =
  | 'NON_FINITE_NUMBER'
  | 'EMPTY_COEFFICIENTS'
  | 'ZERO_DENOMINATOR'
  | 'IMPROPER_TRANSFER_FUNCTION'
  | 'INVALID_DELAY'
  | 'INVALID_DURATION'
  | 'INVALID_POINTS'
  | 'LOOP_NOT_WELL_POSED';

/**
 * A loop description that matches the request schema but cannot be
 * simulated; `path` names the offending field (e.g. "plant.denominator").
 */
export class TimeResponseInputError extends Error {
  readonly code: TimeResponseErrorCode;
  readonly path: string;

  constructor(code: TimeResponseErrorCode, path: string, message: string) {
    super(message);
    this.name = 'TimeResponseInputError';
    this.code = code;
    this.path = path;
  }
}
