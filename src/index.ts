/**
 * loopgate as a library: `analyze(body)` returns exactly what
 * POST /v1/analyses answers. The numeric layers are exported for callers
 * who want to go below the contract.
 */
export { analyze } from './contract/analyze.js';
export { runChecks, compareTunings, describeCriteria } from './gate/index.js';
export { LoopgateError, ERROR_CATALOGUE, type ErrorCode } from './contract/errors.js';
export { bodePlotSvg, nyquistPlotSvg, stepPlotSvg } from './contract/plots.js';
export { reportHtml } from './contract/report.js';
export { BOTTLING_PLANT_LOOPS, FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP, type DemoLoop } from './demo/bottling-plant.js';
export type { AnalysisRequest } from './contract/schemas/analysis-request.js';
export type { AnalysisResponse } from './contract/schemas/analysis-response.js';
export { VERSION } from './version.js';
export * as numeric from './numeric/index.js';
export * as model from './model/index.js';
export * as analysis from './analysis/index.js';
export * as gate from './gate/index.js';
export * as render from './render/index.js';
