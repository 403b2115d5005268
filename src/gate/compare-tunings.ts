/**
 * `compareTunings(body)`: exactly what POST /v1/comparisons answers. Both
 * controllers are analysed on the same plant and judged under the same
 * criteria; each figure's change is candidate − baseline.
 */
import { LoopgateError } from '../contract/errors.js';
import { SAFETY_CAUTION } from '../contract/caution.js';
import { parseBody } from '../contract/parse-body.js';
import { requestHash } from '../contract/request-hash.js';
import { ComparisonRequestSchema, type ComparisonRequest, type ComparisonResponse } from '../contract/schemas/comparisons.js';
import { VERSION } from '../version.js';
import { analyseForGate } from './check-loop.js';
import { judgeLoop } from './judge-loop.js';
import { figureChanges } from './figure-changes.js';
import { resolveGateCriteria, type ResolvedCriteria } from './resolve-gate-criteria.js';

type Role = 'baseline' | 'candidate';

/** Analyses one tuning; a controller error points at `baseline` or `candidate` instead of `controller`. */
function judgeTuning(request: ComparisonRequest, role: Role, criteria: ResolvedCriteria): ComparisonResponse[Role] {
  try {
    const { analysis, loopDelay } = analyseForGate({ plant: request.plant, controller: request[role] }, []);
    const { verdict, findings } = judgeLoop(analysis, criteria, loopDelay);
    return { verdict, findings, analysis };
  } catch (err) {
    if (!(err instanceof LoopgateError)) throw err;
    const issues = err.issues?.map((i) => ({ ...i, path: i.path[0] === 'controller' ? [role, ...i.path.slice(1)] : i.path }));
    throw new LoopgateError(err.code, issues?.some((i) => i.path[0] === role) ? `${role}: ${err.message}` : err.message, issues);
  }
}

export function compareTunings(body: unknown): ComparisonResponse {
  const request = parseBody(ComparisonRequestSchema, body);
  const criteria = resolveGateCriteria(request.criteria);
  const baseline = judgeTuning(request, 'baseline', criteria);
  const candidate = judgeTuning(request, 'candidate', criteria);
  return {
    version: VERSION,
    requestHash: requestHash(body),
    profile: criteria.profile,
    baseline,
    candidate,
    changes: figureChanges(baseline.analysis, candidate.analysis),
    caution: SAFETY_CAUTION,
  };
}
