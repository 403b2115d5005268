export { analyzeLoop, type LoopAnalysis, type AnalysisOptions, type Stability, type ResponseGridRequest } from './analyze-loop.js';
export { DEFAULT_CRITERIA, CRITERIA_SOURCES, resolveCriteria, type Criteria } from './criteria.js';
export { WARNING_CODES, type Warning } from './warnings.js';
export type { Margins, GainCrossover, PhaseCrossover } from './margins.js';
export type { Peak } from './peaks.js';
export type { Bandwidth } from './bandwidth.js';
export type { FrequencyResponse } from './response.js';
