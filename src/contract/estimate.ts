/** `estimate(body)`: what POST /v1/estimates answers (Welch-averaged H1 with coherence). */
import { estimateFrequencyResponse, EstimationInputError } from '../estimation/index.js';
import { VERSION } from '../version.js';
import { LoopgateError, isErrorCode } from './errors.js';
import { parseBody } from './parse-body.js';
import { requestHash } from './request-hash.js';
import { EstimateRequestSchema } from './schemas/estimate.js';
import type { z } from 'zod';
import type { EstimateResponseSchema } from './schemas/estimate.js';

export type EstimateResponse = z.infer<typeof EstimateResponseSchema>;

export function estimate(body: unknown): EstimateResponse {
  const request = parseBody(EstimateRequestSchema, body);
  try {
    const e = estimateFrequencyResponse(request);
    return {
      version: VERSION,
      requestHash: requestHash(body),
      frequency: e.frequency,
      magnitude: e.magnitude,
      phase: e.phase,
      coherence: e.coherence,
      segments: e.segments,
      segmentLength: e.segmentLength,
      overlapSamples: e.overlapSamples,
      sampleRate: e.sampleRate,
      window: e.window,
      detrend: e.detrend,
      method: 'Welch-averaged cross and auto spectra (Welch 1967), H1 = Pyu/Puu and magnitude-squared coherence (Bendat & Piersol, Random Data)',
      plant: e.plant,
    };
  } catch (err) {
    if (err instanceof EstimationInputError) {
      const code = isErrorCode(err.code) ? err.code : 'validation_failed';
      throw new LoopgateError(code, err.message, [{ path: [...err.path], message: err.message }]);
    }
    throw err;
  }
}
