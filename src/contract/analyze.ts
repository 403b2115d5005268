/**
 * `analyze(body)`: exactly what POST /v1/analyses answers, for callers in
 * JavaScript. Throws LoopgateError (with statusCode, code, message, issues)
 * for anything that cannot be analysed.
 */
import { analyzeLoop } from '../analysis/analyze-loop.js';
import { resolveCriteria } from '../analysis/criteria.js';
import { VERSION } from '../version.js';
import { asContractError, buildLoop } from './build-loop.js';
import { SAFETY_CAUTION } from './caution.js';
import { checkAnalysisRequest } from './check-analysis-request.js';
import { attachMeasuredAssessment } from './measured-answer.js';
import { analyzeDiscreteRequest, attachSampledAnalysis } from './sampled-answer.js';
import { checkSampledRequest, isDiscretePlant } from './sampled-request.js';
import { parseBody } from './parse-body.js';
import { requestHash } from './request-hash.js';
import { timeResponsePart } from './time-response-answer.js';
import { AnalysisRequestSchema, type AnalysisRequest } from './schemas/analysis-request.js';
import type { AnalysisResponse } from './schemas/analysis-response.js';

export function analyzeRequest(request: AnalysisRequest, hash: string): AnalysisResponse {
  checkAnalysisRequest(request);
  checkSampledRequest(request);
  // A plant given in z has no continuous design: the sampled loop is the whole answer.
  if (isDiscretePlant(request.plant)) return { version: VERSION, requestHash: hash, ...analyzeDiscreteRequest(request), caution: SAFETY_CAUTION };
  const built = buildLoop(request);
  const { loop, unfilteredDerivative } = built;
  const result = asContractError(() =>
    analyzeLoop(loop, {
      criteria: resolveCriteria(request.criteria ?? {}),
      responseGrid: request.frequency,
      includeResponse: (request.detail ?? 'full') === 'full',
      unfilteredDerivative,
    }),
  );
  asContractError(() => attachMeasuredAssessment(built, result));
  attachSampledAnalysis(request, built, result);
  const timed = timeResponsePart(request, built, result.warnings);
  return { version: VERSION, requestHash: hash, ...result, ...timed, caution: SAFETY_CAUTION };
}

export function analyze(body: unknown): AnalysisResponse {
  const request = parseBody(AnalysisRequestSchema, body);
  return analyzeRequest(request, requestHash(body));
}
