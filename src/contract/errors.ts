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
  // 401/403/429: access (src/http/api-keys.ts, src/http/security.ts)
  unauthorized: { statusCode: 401, description: 'API keys are required here: send Authorization: Bearer <key>.' },
  forbidden: { statusCode: 403, description: 'The API key is not one of the configured keys.' },
  rate_limited: { statusCode: 429, description: 'Too many requests for this key or address in the current window; see Retry-After.' },
  // 413: size limits
  body_too_large: { statusCode: 413, description: 'The body is larger than the route allows.' },
  too_many_points: { statusCode: 413, description: 'The frequency grid asks for more points than allowed.' },
  polynomial_too_large: { statusCode: 413, description: 'A polynomial is of higher degree than allowed.' },
  state_space_too_large: { statusCode: 413, description: 'The state-space model has more states than allowed.' },
  expression_too_long: { statusCode: 413, description: 'The expression is longer than allowed.' },
  too_many_roots: { statusCode: 413, description: 'More zeros or poles than allowed.' },
  too_many_loops: { statusCode: 413, description: 'A check names more loops than allowed (1,000).' },
  too_many_measured_points: { statusCode: 413, description: 'Measured data has more points than allowed.' },
  record_too_long: { statusCode: 413, description: 'A record is longer than 2,000,000 samples.' },
  work_budget_exceeded: { statusCode: 413, description: 'The request asks for more work (grid points × model order, summed over its loops) than LOOPGATE_MAX_WORK allows.' },
  batch_too_large: { statusCode: 413, description: 'The request holds more loops than LOOPGATE_MAX_BATCH allows.' },
  too_many_delay_samples: { statusCode: 413, description: 'A sampled loop whose delay spans more than 5,000 samples.' },
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
  analysis_too_costly: { statusCode: 422, description: 'The loop would need more frequency points than the compute budget allows (a very long delay over a wide band).' },
  loop_not_finite: { statusCode: 422, description: 'The loop evaluates to NaN or ±∞ on the imaginary axis.' },
  numerically_unanalysable: { statusCode: 422, description: 'A numerical routine could not bracket or converge on this loop.' },
  neutral_loop: { statusCode: 422, description: 'A biproper loop with delay and |L(∞)| ≥ 1 (neutral closed loop).' },
  time_response_not_simulable: { statusCode: 422, description: 'The loop cannot be simulated in time (see issues[].path): a duration or point count out of range, a loop without a solution.' },
  time_response_unavailable: { statusCode: 422, description: 'This plant kind has no time simulation (an expression in s, measured data); the step plot needs a rational plant.' },
  csv_invalid: { statusCode: 422, description: 'The CSV table cannot be read (header, row length, a cell that is not a number).' },
  measured_data_ambiguous: { statusCode: 422, description: 'Measured data given both as csv and as arrays.' },
  measured_data_incomplete: { statusCode: 422, description: 'Measured data lacks frequency, or a full magnitude/phase or real/imag pair.' },
  measured_data_lengths: { statusCode: 422, description: 'Measured columns differ in length.' },
  measured_data_too_short: { statusCode: 422, description: 'Fewer than 4 measured frequencies.' },
  measured_frequency_not_positive: { statusCode: 422, description: 'A measured frequency is zero or negative.' },
  measured_frequency_duplicated: { statusCode: 422, description: 'A measured frequency appears twice.' },
  measured_frequency_unsorted: { statusCode: 422, description: 'Measured frequencies are not increasing.' },
  measured_magnitude_not_positive: { statusCode: 422, description: 'A measured magnitude is zero or negative.' },
  coherence_out_of_range: { statusCode: 422, description: 'A coherence value is outside [0, 1].' },
  // 422: sampled loops (controller.implementation, plants in z)
  sample_period_missing: { statusCode: 422, description: 'A plant with variable "z" lacks its samplePeriod.' },
  discrete_fields_without_z: { statusCode: 422, description: 'samplePeriod or coefficientOrder given for a plant that is not in z.' },
  controller_implementation_missing: { statusCode: 422, description: 'The plant is in z but the controller has no implementation (samplePeriod, method).' },
  sample_period_mismatch: { statusCode: 422, description: 'The controller and the plant have different sample periods.' },
  prewarp_frequency_too_high: { statusCode: 422, description: 'The prewarping frequency is not below the Nyquist frequency π/Ts.' },
  fractional_sample_delay: { statusCode: 422, description: 'A delay of a plant in z (or a computation delay with one) is not a whole number of samples.' },
  discrete_plant_non_causal: { statusCode: 422, description: 'A plant in z with more zeros than poles, or a0 = 0.' },
  discrete_controller_non_causal: { statusCode: 422, description: 'Forward Euler of an unfiltered derivative: the controller would need the next sample.' },
  discretisation_singular: { statusCode: 422, description: 'A controller root at s = 2/Ts (the bilinear scale), which Tustin sends to z = ∞.' },
  discrete_loop_non_causal: { statusCode: 422, description: 'The sampled loop has more zeros than poles in z.' },
  discrete_loop_algebraic: { statusCode: 422, description: 'The sampled loop has a direct feedthrough of −1 (an algebraic loop).' },
  sampled_plant_not_rational: { statusCode: 422, description: 'The exact sample-and-hold equivalent was asked of a plant without a rational model.' },
  improper_plant: { statusCode: 422, description: 'A plant with more zeros than poles has no sample-and-hold equivalent.' },
  discrete_plant_not_supported_here: { statusCode: 422, description: 'A plant in z sent to a route that reviews continuous loops only (checks, reports).' },
  // 422 from the estimation of a frequency response (POST /v1/estimates)
  sample_rate_invalid: { statusCode: 422, description: 'sampleRate is not a positive number.' },
  record_invalid: { statusCode: 422, description: 'input or output is not an array of numbers.' },
  record_lengths_differ: { statusCode: 422, description: 'input and output differ in length.' },
  record_too_short: { statusCode: 422, description: 'The records give fewer than two segments to average.' },
  sample_not_finite: { statusCode: 422, description: 'A sample is not a finite number.' },
  segment_length_invalid: { statusCode: 422, description: 'segmentLength is not an allowed power of two.' },
  segment_length_too_long: { statusCode: 422, description: 'segmentLength leaves fewer than two segments.' },
  overlap_invalid: { statusCode: 422, description: 'overlap is outside [0, 0.9].' },
  window_unknown: { statusCode: 422, description: 'Unknown window.' },
  detrend_unknown: { statusCode: 422, description: 'Unknown detrend mode.' },
  input_without_power: { statusCode: 422, description: 'The input has no power in some frequency bin (H1 undefined there).' },
  output_without_power: { statusCode: 422, description: 'The output has no power in some frequency bin (coherence undefined there).' },
  // 503: load shedding and time limits (src/http/load-shedding.ts, src/http/analysis-pool.ts)
  overloaded: { statusCode: 503, description: 'The service is saturated and sheds load; retry after Retry-After seconds.' },
  analysis_timeout: { statusCode: 503, description: 'The computation did not finish within LOOPGATE_REQUEST_TIMEOUT_MS and was stopped.' },
  shutting_down: { statusCode: 503, description: 'The service is shutting down and takes no new work.' },
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
