/**
 * The computations that may run off the event loop, by name. Each takes the
 * raw request body and returns exactly what its route answers (or throws a
 * LoopgateError). The worker and the inline runner both use this table, so
 * the two modes cannot drift apart.
 */
import { analyze } from '../contract/analyze.js';
import { estimate } from '../contract/estimate.js';

export const COMPUTE_TASKS = {
  analyze: (body: unknown): unknown => analyze(body),
  estimate: (body: unknown): unknown => estimate(body),
} as const;

export type ComputeTaskName = keyof typeof COMPUTE_TASKS;

export interface ComputeRequest {
  id: number;
  task: ComputeTaskName;
  body: unknown;
}

export type ComputeReply =
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: false; error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] } }
  | { id: number; ok: false; fault: string };
