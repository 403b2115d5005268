/**
 * The result of one loop as it crosses a worker boundary: a check, a
 * refusal (a LoopgateError, as JSON) or a fault of ours. Plain data, so it
 * survives structured cloning.
 */
import { LoopgateError, isErrorCode, type ErrorIssue } from '../contract/errors.js';
import type { LoopCheck } from '../contract/schemas/checks.js';
import { checkLoop, type LoopTask } from './check-loop.js';

export type LoopOutcome =
  | { index: number; kind: 'checked'; check: LoopCheck }
  | { index: number; kind: 'refused'; code: string; message: string; issues?: ErrorIssue[] }
  | { index: number; kind: 'fault'; message: string };

export function runLoopTask(task: LoopTask): LoopOutcome {
  try {
    return { index: task.index, kind: 'checked', check: checkLoop(task) };
  } catch (err) {
    if (err instanceof LoopgateError) return { index: task.index, kind: 'refused', code: err.code, message: err.message, issues: err.issues };
    return { index: task.index, kind: 'fault', message: err instanceof Error ? err.message : String(err) };
  }
}

/** Outcomes in task order → the checks, or the error of the first loop that could not be checked. */
export function checksOrThrow(outcomes: readonly LoopOutcome[]): LoopCheck[] {
  const sorted = [...outcomes].sort((a, b) => a.index - b.index);
  const checks: LoopCheck[] = [];
  for (const o of sorted) {
    if (o.kind === 'checked') {
      checks.push(o.check);
      continue;
    }
    if (o.kind === 'refused' && isErrorCode(o.code)) {
      throw new LoopgateError(o.code, `loops[${o.index}]: ${o.message}`, o.issues);
    }
    throw new LoopgateError('internal_error', `An internal error occurred while checking loops[${o.index}]; please report it with the request.`);
  }
  return checks;
}
