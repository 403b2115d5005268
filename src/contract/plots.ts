/**
 * The plot routes' work, callable without HTTP: parse the analysis request,
 * analyse it with the responses the figure needs, draw. The figure's
 * numbers are the analysis' own (the same as POST /v1/analyses answers).
 */
import { renderBodePlot } from '../render/bode-figure.js';
import { renderNyquistPlot } from '../render/nyquist-figure.js';
import { renderStepPlot } from '../render/step-plot.js';
import { analyzeRequest } from './analyze.js';
import { LoopgateError } from './errors.js';
import { parseBody } from './parse-body.js';
import { requestHash } from './request-hash.js';
import { AnalysisRequestSchema } from './schemas/analysis-request.js';
import type { AnalysisResponse } from './schemas/analysis-response.js';
import { TIME_RESPONSE_UNAVAILABLE } from './time-response-answer.js';

function analyseWithResponse(body: unknown): AnalysisResponse {
  const request = parseBody(AnalysisRequestSchema, body);
  return analyzeRequest({ ...request, detail: 'full' }, requestHash(body));
}

export function bodePlotSvg(body: unknown, options: { closedLoop?: boolean } = {}): string {
  return renderBodePlot(analyseWithResponse(body), options);
}

export function nyquistPlotSvg(body: unknown): string {
  return renderNyquistPlot(analyseWithResponse(body));
}

/** The step figure; 422 `time_response_unavailable` for plants without a time simulation. */
export function stepPlotSvg(body: unknown): string {
  const request = parseBody(AnalysisRequestSchema, body);
  const a = analyzeRequest({ ...request, detail: 'summary', timeResponse: request.timeResponse ?? {} }, requestHash(body));
  if (!a.timeResponse) {
    const why = a.warnings.find((w) => w.code === TIME_RESPONSE_UNAVAILABLE)?.message ?? 'No time response for this loop.';
    throw new LoopgateError('time_response_unavailable', why, [{ path: ['plant', 'kind'], message: why }]);
  }
  return renderStepPlot(a.timeResponse);
}
