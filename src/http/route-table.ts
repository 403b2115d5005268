/**
 * Every route with its purpose and the ids of its schemas: the single list
 * the OpenAPI document, the README table and the tests read.
 */
import '../contract/schemas/analysis-request.js';
import '../contract/schemas/analysis-response.js';
import '../contract/schemas/report-request.js';
import '../contract/schemas/checks.js';
import '../contract/schemas/comparisons.js';
import '../contract/schemas/criteria-profiles.js';
import '../contract/schemas/estimate.js';
import './schemas/health.js';
import './schemas/readiness.js';

export interface RouteInfo {
  method: 'GET' | 'POST';
  path: string;
  operationId: string;
  summary: string;
  request?: string;
  response?: string;
  produces?: string;
}

export const ROUTES: RouteInfo[] = [
  { method: 'GET', path: '/healthz', operationId: 'health', summary: 'Liveness: the process answers.', response: 'Health' },
  { method: 'GET', path: '/readyz', operationId: 'readiness', summary: 'Readiness: 200 while taking work, 503 (shutting_down, overloaded) while draining or shedding load.', response: 'Readiness' },
  { method: 'GET', path: '/metrics', operationId: 'metrics', summary: 'Prometheus metrics: requests and durations per route and status, analyses by plant kind, verdicts by outcome, event-loop lag.', produces: 'text/plain; version=0.0.4' },
  { method: 'GET', path: '/openapi.json', operationId: 'openapiDocument', summary: 'This OpenAPI 3.1 document.' },
  {
    method: 'POST',
    path: '/v1/analyses',
    operationId: 'analyseLoop',
    summary: 'Margins, peaks, bandwidths, stability, warnings and frequency responses of one loop.',
    request: 'AnalysisRequest',
    response: 'AnalysisResponse',
  },
  {
    method: 'POST',
    path: '/v1/checks',
    operationId: 'checkLoops',
    summary: 'Verdicts (pass, warn, fail) with findings for up to 1,000 loops under a criteria profile.',
    request: 'CheckRequest',
    response: 'CheckResponse',
  },
  {
    method: 'POST',
    path: '/v1/comparisons',
    operationId: 'compareTunings',
    summary: 'The tuning in service and a candidate on one plant: both analyses, verdicts, and the change in each figure.',
    request: 'ComparisonRequest',
    response: 'ComparisonResponse',
  },
  { method: 'GET', path: '/v1/criteria', operationId: 'listCriteriaProfiles', summary: 'The criteria profiles, each limit with its severity and source.', response: 'CriteriaProfiles' },
  {
    method: 'POST',
    path: '/v1/estimates',
    operationId: 'estimateFrequencyResponse',
    summary: 'Frequency response (H1, Welch-averaged) and coherence from input/output records; answers a ready-to-post measured plant.',
    request: 'EstimateRequest',
    response: 'EstimateResponse',
  },
  {
    method: 'POST',
    path: '/v1/plots/bode',
    operationId: 'drawBodePlot',
    summary: 'Bode figure (SVG) of L, with |S| and |T| (?closedLoop=false leaves them off); crossovers, margins and peaks marked.',
    request: 'AnalysisRequest',
    produces: 'image/svg+xml',
  },
  {
    method: 'POST',
    path: '/v1/plots/nyquist',
    operationId: 'drawNyquistPlot',
    summary: 'Nyquist figure (SVG) near −1 with the unit circle, the 1/Ms circle and an overview of the whole curve.',
    request: 'AnalysisRequest',
    produces: 'image/svg+xml',
  },
  {
    method: 'POST',
    path: '/v1/plots/step',
    operationId: 'drawStepPlot',
    summary: 'Closed-loop setpoint and load-step responses (SVG) with overshoot, settling and peak deviation marked; rational plants.',
    request: 'AnalysisRequest',
    produces: 'image/svg+xml',
  },
  {
    method: 'POST',
    path: '/v1/reports',
    operationId: 'makeReviewReport',
    summary: 'Design-review report: one self-contained HTML page with the loop, the figures marked against the criteria, the three plots, warnings and the safety caution.',
    request: 'ReportRequest',
    produces: 'text/html',
  },
  { method: 'GET', path: '/', operationId: 'reviewPage', summary: 'A page for people: paste, upload or pick a demo request and see its report.', produces: 'text/html' },
];
