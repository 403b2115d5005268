/**
 * Every route with its purpose and the ids of its schemas: the single list
 * the OpenAPI document, the README table and the tests read.
 */
import '../contract/schemas/analysis-request.js';
import '../contract/schemas/analysis-response.js';
import './schemas/health.js';

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
  { method: 'GET', path: '/openapi.json', operationId: 'openapiDocument', summary: 'This OpenAPI 3.1 document.' },
  {
    method: 'POST',
    path: '/v1/analyses',
    operationId: 'analyseLoop',
    summary: 'Margins, peaks, bandwidths, stability, warnings and frequency responses of one loop.',
    request: 'AnalysisRequest',
    response: 'AnalysisResponse',
  },
];
