/**
 * The error catalogue: every error code loopgate answers with, its HTTP
 * status and what it means. Codes are stable; messages may improve.
 *
 * 400 — the body does not match the schema.
 * 413 — over a size limit.
 * 422 — well formed but cannot be analysed.
 */
export const ERROR_CATALOGUE = {
  // 400: shape
  validation_failed: { statusCode: 400, description: 'The body does not match the schema; see issues[].path.' },
  invalid_json: { statusCode: 400, description: 'The body is not valid JSON.' },
  forbidden_key: { statusCode: 400, description: 'The body contains a key such as __proto__ or constructor.prototype.' },
  // 404/405/415: routing and transport
  not_found: { statusCode: 404, description: 'No such route.' },
  unsupported_media_type: { statusCode: 415, description: 'The body must be application/json.' },
  // 413: size limits
  body_too_large: { statusCode: 413, description: 'The body is larger than the route allows.' },
  too_many_points: { statusCode: 413, description: 'The frequency grid asks for more points than allowed.' },
  polynomial_too_large: { statusCode: 413, description: 'A polynomial is of higher degree than allowed.' },
  state_space_too_large: { statusCode: 413, description: 'The state-space model has more states than allowed.' },
  expression_too_long: { statusCode: 413, description: 'The expression is longer than allowed.' },
  too_many_roots: { statusCode: 413, description: 'More zeros or poles than allowed.' },
  // 422: cannot be analysed
  non_finite_number: { statusCode: 422, description: 'A number is not finite (NaN, ±Infinity, or a JSON number that overflows).' },
  negative_time: { statusCode: 422, description: 'A delay or time constant is negative.' },
  invalid_frequency_grid: { statusCode: 422, description: 'The frequency grid has min ≤ 0 or min ≥ max.' },
  zero_denominator: { statusCode: 422, description: 'A denominator is empty or identically zero.' },
  zero_numerator: { statusCode: 422, description: 'The plant is identically zero.' },
  zero_controller: { statusCode: 422, description: 'Every controller term is zero.' },
  unpaired_complex_root: { statusCode: 422, description: 'A complex root comes without its conjugate.' },
  state_space_shape: { statusCode: 422, description: 'The matrices of a state-space model do not fit together (SISO only).' },
  expression_syntax: { statusCode: 422, description: 'The expression cannot be parsed.' },
  expression_not_allowed: { statusCode: 422, description: 'The expression uses something outside the whitelist.' },
  expression_too_deep: { statusCode: 422, description: 'The expression nests too deeply.' },
  expression_not_finite: { statusCode: 422, description: 'The expression does not evaluate to finite numbers.' },
  integral_time_not_positive: { statusCode: 422, description: 'integralTime must be positive.' },
  derivative_filter_undefined: { statusCode: 422, description: 'A derivative filter given as N needs a defined derivative time.' },
  improper_loop: { statusCode: 422, description: 'The loop C·P is improper.' },
  closed_loop_improper: { statusCode: 422, description: 'L(∞) = −1: the closed loop is improper.' },
  neutral_loop: { statusCode: 422, description: 'A biproper loop with delay and |L(∞)| ≥ 1 (neutral closed loop).' },
  // 500: only for our own faults, never for anything a caller sent
  internal_error: { statusCode: 500, description: 'A fault inside loopgate; please report it with the request hash.' },
} as const satisfies Record<string, { statusCode: number; description: string }>;

export type ErrorCode = keyof typeof ERROR_CATALOGUE;

export interface ErrorIssue {
  path: (string | number)[];
  message: string;
}

/** An error answer: JSON with statusCode, code, message and, for validation, issues. */
export class LoopgateError extends Error {
  readonly statusCode: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly issues?: ErrorIssue[],
  ) {
    super(message);
    this.name = 'LoopgateError';
    this.statusCode = ERROR_CATALOGUE[code].statusCode;
  }

  toJSON(): { statusCode: number; code: string; message: string; issues?: ErrorIssue[] } {
    return { statusCode: this.statusCode, code: this.code, message: this.message, ...(this.issues ? { issues: this.issues } : {}) };
  }
}

export const isErrorCode = (code: string): code is ErrorCode => Object.hasOwn(ERROR_CATALOGUE, code);
