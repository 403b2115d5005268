/**
 * The compute budget, checked on every request with a body before its
 * route runs: more loops than LOOPGATE_MAX_BATCH (413 batch_too_large),
 * more work than LOOPGATE_MAX_WORK (413 work_budget_exceeded), or an array
 * of numbers longer than LOOPGATE_MAX_RECORD_LENGTH (413 record_too_long).
 * The estimate stays on the request for the log line and the metrics.
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { LoopgateError } from '../contract/errors.js';
import { estimateWork, type WorkEstimate } from './work-estimate.js';

declare module 'fastify' {
  interface FastifyRequest {
    workEstimate?: WorkEstimate;
  }
}

export interface BudgetLimits {
  maxWork: number;
  maxBatch: number;
  maxRecordLength: number;
}

export function checkBudget(estimate: WorkEstimate, limits: BudgetLimits): void {
  if (estimate.loops.length > limits.maxBatch) {
    throw new LoopgateError('batch_too_large', `The request holds ${estimate.loops.length} loops; at most ${limits.maxBatch} are allowed in one request.`);
  }
  if (estimate.longestRecord > limits.maxRecordLength) {
    throw new LoopgateError('record_too_long', `An array holds ${estimate.longestRecord} numbers; at most ${limits.maxRecordLength} are allowed.`);
  }
  if (estimate.work > limits.maxWork) {
    throw new LoopgateError(
      'work_budget_exceeded',
      `The request asks for about ${estimate.work.toExponential(2)} point·order units of work (frequency points × model order over ${estimate.loops.length} loops); the budget is ${limits.maxWork.toExponential(2)}. Ask for fewer points, fewer loops or smaller models.`,
    );
  }
}

/**
 * Work (frequency points × model order, work-estimate.ts) up to which a request counts as light:
 * a loop of order 20 on its response grid plus the analysis allowance. The benchmark's loops
 * (2nd order with delay, 10th order, 400 points) are 4,800 and 19,200. The compute pool may queue
 * a light task behind another light one instead of waking a second worker (compute-pool.ts).
 */
export const LIGHT_WORK = 50_000;

export function isLightRequest(request: FastifyRequest): boolean {
  return (request.workEstimate?.work ?? Infinity) <= LIGHT_WORK;
}

export function installComputeBudget(app: FastifyInstance, limits: BudgetLimits): void {
  app.addHook('preValidation', async (request) => {
    if (request.body === undefined || request.body === null || typeof request.body !== 'object') return;
    const estimate = estimateWork(request.body);
    request.workEstimate = estimate;
    checkBudget(estimate, limits);
  });
}
