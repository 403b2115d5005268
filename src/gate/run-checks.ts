/**
 * `runChecks(body)`: exactly what POST /v1/checks answers. The batch is
 * refused whole (400/413/422, issues[].path under ['loops', i]) when any
 * loop cannot be analysed: a QA gate must not pass a broken input quietly.
 */
import { LoopgateError } from '../contract/errors.js';
import { SAFETY_CAUTION } from '../contract/caution.js';
import { parseBody } from '../contract/parse-body.js';
import { requestHash } from '../contract/request-hash.js';
import { CheckRequestSchema, type CheckRequest, type CheckResponse } from '../contract/schemas/checks.js';
import { VERSION } from '../version.js';
import type { LoopTask } from './check-loop.js';
import { DEFAULT_PROFILE } from './criteria-profiles.js';
import { GATE_LIMITS } from './limits.js';
import { checksOrThrow } from './loop-outcome.js';
import { resolveGateCriteria } from './resolve-gate-criteria.js';
import { runLoopTasks, type RunOptions } from './run-loop-tasks.js';
import { worstVerdict } from './verdict.js';

/** Counted before the schema, so an oversized batch is refused without validating it. */
function refuseOversizedBatch(body: unknown): void {
  const loops = body && typeof body === 'object' ? (body as { loops?: unknown }).loops : undefined;
  if (Array.isArray(loops) && loops.length > GATE_LIMITS.maxLoops) {
    const message = `The request has ${loops.length} loops; at most ${GATE_LIMITS.maxLoops} are allowed in one check.`;
    throw new LoopgateError('too_many_loops', message, [{ path: ['loops'], message }]);
  }
}

function refuseDuplicateNames(request: CheckRequest): void {
  const seen = new Map<string, number>();
  request.loops.forEach((loop, i) => {
    const first = seen.get(loop.name);
    if (first !== undefined) {
      const message = `The loop name "${loop.name}" is used by loops[${first}] and loops[${i}]; names must be unique (they name the report's test cases).`;
      throw new LoopgateError('validation_failed', message, [{ path: ['loops', i, 'name'], message }]);
    }
    seen.set(loop.name, i);
  });
}

export function parseCheckRequest(body: unknown): CheckRequest {
  refuseOversizedBatch(body);
  const request = parseBody(CheckRequestSchema, body);
  refuseDuplicateNames(request);
  return request;
}

export function loopTasks(request: CheckRequest): LoopTask[] {
  return request.loops.map((loop, index) => ({
    index,
    name: loop.name,
    plant: loop.plant,
    controller: loop.controller,
    criteria: resolveGateCriteria(request.criteria, loop.criteria),
  }));
}

export async function runChecks(body: unknown, options: RunOptions = {}): Promise<CheckResponse> {
  const request = parseCheckRequest(body);
  const hash = requestHash(body);
  const loops = checksOrThrow(await runLoopTasks(loopTasks(request), options));
  const counts = { pass: 0, warn: 0, fail: 0 };
  for (const l of loops) counts[l.verdict]++;
  return {
    version: VERSION,
    requestHash: hash,
    verdict: worstVerdict(loops.map((l) => l.verdict)),
    profile: request.criteria?.profile ?? DEFAULT_PROFILE,
    counts,
    loops,
    caution: SAFETY_CAUTION,
  };
}
