/**
 * Load shedding (@fastify/under-pressure): when the event loop lags or is
 * saturated, or memory passes its bound, /v1 requests are refused at once
 * with 503 `overloaded` and Retry-After rather than queued without bound.
 * Health, readiness, metrics and OpenAPI keep answering so an operator can
 * see what is happening. (Analyses run on worker threads, whose own queue
 * bound sheds with the same code; see compute-pool.ts.)
 */
import underPressure from '@fastify/under-pressure';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { LoopgateError } from '../contract/errors.js';
import { isApiPath } from './protected-paths.js';

export interface PressureLimits {
  maxEventLoopDelayMs: number;
  maxEventLoopUtilization: number;
  maxHeapBytes: number;
  maxRssBytes: number;
}

export const RETRY_AFTER_SECONDS = 2;

type PressureHandler = NonNullable<Parameters<typeof underPressure>[1]['pressureHandler']>;

/**
 * undefined lets the request through; any other value is what the plugin
 * sends instead (its types say void, its code sends a returned value).
 */
function shedApiRequests(request: FastifyRequest, reply: FastifyReply, type: string, value: number | undefined): unknown {
  if (!isApiPath(request.url)) return undefined;
  reply.status(503).header('retry-after', String(RETRY_AFTER_SECONDS));
  const what = typeof value === 'number' ? `${type} at ${Number(value.toPrecision(3))}` : type;
  return new LoopgateError('overloaded', `loopgate is saturated (${what}) and sheds load; retry in ${RETRY_AFTER_SECONDS} s.`).toJSON();
}

export async function installLoadShedding(app: FastifyInstance, limits: PressureLimits): Promise<void> {
  await app.register(underPressure, {
    maxEventLoopDelay: limits.maxEventLoopDelayMs,
    maxEventLoopUtilization: limits.maxEventLoopUtilization,
    maxHeapUsedBytes: limits.maxHeapBytes,
    maxRssBytes: limits.maxRssBytes,
    sampleInterval: 250,
    pressureHandler: shedApiRequests as PressureHandler,
  });
}
