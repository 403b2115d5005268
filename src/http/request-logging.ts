/**
 * One JSON log line per answered request (pino, through fastify's request
 * logger, so it carries reqId): method, route template, status, duration,
 * the key's fingerprint, and for requests with loops their count, largest
 * model order and grid size (points of the answer's grid when it has one,
 * else the response-grid points asked for). Bodies are never logged, and the
 * Authorization header is redacted should anything log the headers.
 */
import type { FastifyInstance, FastifyServerOptions } from 'fastify';
import { gridPointsOf } from './serialized-answer.js';

declare module 'fastify' {
  interface FastifyRequest {
    /** Grid points of the answer: read before serialisation, or carried by a SerializedAnswer. */
    answeredGridPoints?: number;
  }
}

export const LOG_REDACTIONS = ['req.headers.authorization', 'headers.authorization', 'request.headers.authorization'];

/** The logger option with the redactions added; `false` stays off. */
export function withRedaction(logger: FastifyServerOptions['logger']): FastifyServerOptions['logger'] {
  if (!logger) return false;
  const base = logger === true ? {} : (logger as Record<string, unknown>);
  return { ...base, redact: { paths: LOG_REDACTIONS, censor: '[redacted]' } };
}

export function installRequestLogging(app: FastifyInstance): void {
  app.addHook('preSerialization', async (request, _reply, payload) => {
    request.answeredGridPoints ??= gridPointsOf(payload);
    return payload;
  });
  app.addHook('onResponse', async (request, reply) => {
    const loops = request.workEstimate?.loops ?? [];
    const line: Record<string, unknown> = {
      method: request.method,
      route: request.routeOptions.url ?? 'unmatched',
      statusCode: reply.statusCode,
      durationMs: Math.round(reply.elapsedTime * 100) / 100,
    };
    if (request.apiKeyId) line.apiKey = request.apiKeyId;
    if (loops.length) {
      line.loops = loops.length;
      line.modelOrder = loops.reduce((m, l) => Math.max(m, l.order), 0);
      const asked = loops.reduce((m, l) => Math.max(m, l.requestedPoints), 0);
      if (request.answeredGridPoints !== undefined) line.gridPoints = request.answeredGridPoints;
      else if (asked > 0) line.gridPointsAsked = asked;
      line.plantKinds = [...new Set(loops.slice(0, 1000).map((l) => l.kind))].slice(0, 10);
    }
    request.log.info(line, 'request answered');
  });
}
