/**
 * The one error the estimation routines throw for a request they cannot
 * estimate from. It carries a stable `code` (for the error catalogue), a
 * `path` to the offending field (e.g. `['input', 17]`) and a message a person
 * can act on; the HTTP layer maps it to 422.
 */

/** Every code `EstimationInputError` can carry, with what it means. */
export const ESTIMATION_ERROR_CODES = {
  sample_rate_invalid: 'sampleRate is not a finite positive number',
  record_invalid: 'input or output is not an array of numbers',
  record_lengths_differ: 'input and output have different lengths',
  record_too_long: 'a record is longer than the maximum number of samples',
  record_too_short: 'the record gives fewer segments than averaging needs',
  sample_not_finite: 'a sample is NaN, infinite or not a number',
  segment_length_invalid: 'segmentLength is not a power of two within the allowed range',
  segment_length_too_long: 'segmentLength leaves fewer segments than averaging needs',
  overlap_invalid: 'overlap is not a number in the allowed range',
  window_unknown: 'window names no supported window',
  detrend_unknown: 'detrend names no supported detrending',
  input_without_power: 'the input has no power in some frequency bin, so H1 is undefined there',
  output_without_power: 'the output has no power in some frequency bin, so coherence is undefined there',
} as const;

export type EstimationErrorCode = keyof typeof ESTIMATION_ERROR_CODES;

export class EstimationInputError extends Error {
  override readonly name = 'EstimationInputError';
  readonly code: EstimationErrorCode;
  /** Location of the offending value in the request, as in a validation issue. */
  readonly path: readonly (string | number)[];

  constructor(code: EstimationErrorCode, path: readonly (string | number)[], message: string) {
    super(message);
    this.code = code;
    this.path = path;
  }
}
