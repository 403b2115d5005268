/** Frequency-response estimation from measured input/output records. */
export { estimateFrequencyResponse } from './estimate-frequency-response.js';
export { h1RandomError } from './h1-random-error.js';
export type { H1RandomError } from './h1-random-error.js';
export { defaultSegmentLength } from './default-segment-length.js';
export { EstimationInputError, ESTIMATION_ERROR_CODES } from './estimation-input-error.js';
export type { EstimationErrorCode } from './estimation-input-error.js';
export * from './limits.js';
export type {
  EstimationDetrend,
  EstimationWindow,
  FrequencyResponseEstimate,
  FrequencyResponseEstimateRequest,
  FrequencyResponsePlant,
} from './types.js';
