/**
 * Optional rate limiting of /v1 routes (@fastify/rate-limit, in memory):
 * LOOPGATE_RATE_LIMIT_MAX requests per window per API key, or per client
 * address when no key is in use. Over the limit: 429 `rate_limited` with
 * Retry-After. Must be registered before the routes (it hooks each route
 * as it is added).
 */
import rateLimit from '@fastify/rate-limit';
import type { FastifyInstance } from 'fastify';
import { LoopgateError } from '../contract/errors.js';
import { isApiPath } from './protected-paths.js';

export async function installRateLimit(app: FastifyInstance, max: number, windowMs: number): Promise<void> {
  if (max <= 0) return;
  await app.register(rateLimit, {
    global: true,
    max,
    timeWindow: windowMs,
    // The key's fingerprint when the request passed the API-key check, else the address.
    keyGenerator: (request) => (request.apiKeyId ? `key:${request.apiKeyId}` : `ip:${request.ip}`),
    allowList: (request) => !isApiPath(request.url),
    errorResponseBuilder: (_request, context) =>
      new LoopgateError('rate_limited', `At most ${context.max} requests per ${context.after} are allowed; retry in ${Math.ceil(context.ttl / 1000)} s.`),
  });
}
