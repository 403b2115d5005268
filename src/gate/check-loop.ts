/**
 * One loop of a batch: limits checked, model built, analysed (no response
 * arrays) and judged. Runs inline or inside a worker thread; a loop that
 * cannot be analysed throws LoopgateError with paths under ['loops', i].
 */
import { analyzeLoop } from '../analysis/analyze-loop.js';
import { DEFAULT_CRITERIA } from '../analysis/criteria.js';
import { asContractError, buildLoop } from '../contract/build-loop.js';
import { checkControllerTimes, checkPlantLimits } from '../contract/check-analysis-request.js';
import type { CheckLoop, LoopCheck } from '../contract/schemas/checks.js';
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import { judgeLoop } from './judge-loop.js';
import { LoopgateError } from '../contract/errors.js';
import { checkSampledRequest, isDiscretePlant } from '../contract/sampled-request.js';
import { analyzeDiscreteRequest, attachSampledAnalysis, type SampledBlock } from '../contract/sampled-answer.js';
import { summariseLoop } from './loop-summary.js';
import type { ResolvedCriteria } from './resolve-gate-criteria.js';

export interface LoopTask {
  index: number;
  name: string;
  plant: CheckLoop['plant'];
  controller?: CheckLoop['controller'];
  criteria: ResolvedCriteria;
}

export interface AnalysedLoop {
  analysis: LoopAnalysis;
  /** The loop's pure delay, or null when the plant kind does not state it. */
  loopDelay: number | null;
}

/** Builds and analyses plant + controller; errors carry `pathPrefix` before their own path. */
export function analyseForGate(
  loop: Pick<CheckLoop, 'plant' | 'controller'>,
  pathPrefix: (string | number)[],
): AnalysedLoop {
  checkPlantLimits(loop.plant, [...pathPrefix, 'plant']);
  checkControllerTimes(loop.controller, [...pathPrefix, 'controller']);
  const request = { plant: loop.plant, ...(loop.controller ? { controller: loop.controller } : {}), detail: 'summary' as const };
  withPathPrefix(() => checkSampledRequest(request), pathPrefix);
  // A plant given in z: the sampled loop is the only loop there is.
  if (isDiscretePlant(loop.plant)) {
    return { analysis: withPathPrefix(() => analyzeDiscreteRequest(request), pathPrefix), loopDelay: null };
  }
  const built = buildLoop(loop, pathPrefix);
  // The gate judges by its own criteria; the analysis' threshold warnings are not used.
  const analysis = asContractError(
    () => analyzeLoop(built.loop, { criteria: DEFAULT_CRITERIA, includeResponse: false, unfilteredDerivative: built.unfilteredDerivative }),
    pathPrefix,
  );
  const loopDelay = built.loop.rational ? built.loop.delay : null;
  // A controller with an implementation runs as a sampled loop: that is the loop the gate judges
  // (a continuous design that is stable says nothing about firmware sampled too slowly).
  withPathPrefix(() => attachSampledAnalysis(request, built, analysis), pathPrefix);
  const sampled = (analysis as LoopAnalysis & { sampled?: SampledBlock }).sampled;
  if (!sampled) return { analysis, loopDelay };
  return {
    analysis: {
      ...analysis,
      stability: {
        ...analysis.stability,
        closedLoopStable: sampled.stability.closedLoopStable,
        nyquist: { ...analysis.stability.nyquist, closedLoopUnstablePoles: sampled.stability.nyquist.closedLoopUnstablePoles },
      },
      margins: sampled.margins,
      peaks: sampled.peaks,
      bandwidth: sampled.bandwidth,
    },
    loopDelay,
  };
}

/** Re-throws a LoopgateError with its issue paths under `prefix` (a loop's place in the batch). */
function withPathPrefix<T>(f: () => T, prefix: (string | number)[]): T {
  try {
    return f();
  } catch (err) {
    if (err instanceof LoopgateError && prefix.length) {
      const issues = err.issues?.map((i) => ({ ...i, path: [...prefix, ...i.path] }));
      throw new LoopgateError(err.code, `${prefix.join('.')}: ${err.message}`, issues);
    }
    throw err;
  }
}

export function checkLoop(task: LoopTask): LoopCheck {
  const { analysis, loopDelay } = analyseForGate(task, ['loops', task.index]);
  const judged = judgeLoop(analysis, task.criteria, loopDelay);
  return {
    name: task.name,
    verdict: judged.verdict,
    profile: task.criteria.profile,
    overridden: task.criteria.overridden,
    findings: judged.findings,
    summary: summariseLoop(analysis, loopDelay),
  };
}
