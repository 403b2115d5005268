/**
 * Readiness and draining. GET /healthz (liveness) answers as long as the
 * process does; GET /readyz answers 200 only while the service takes work:
 * 503 `shutting_down` once draining began, 503 `overloaded` while the
 * load-shedding thresholds are crossed or every worker is busy with a full
 * queue. While draining, new /v1 requests on connections still open get 503
 * `shutting_down`, requests already accepted run to their end, and every
 * answer carries `Connection: close`.
 */
import type { FastifyInstance } from 'fastify';
import { LoopgateError } from '../contract/errors.js';
import { VERSION } from '../version.js';
import type { ComputePool } from './compute-pool.js';
import { isApiPath } from './protected-paths.js';

declare module 'fastify' {
  interface FastifyInstance {
    /** Starts draining: readiness fails and new /v1 work is refused. */
    beginDrain(): void;
    readonly draining: boolean;
  }
}

export function installLifecycle(app: FastifyInstance, pool: ComputePool): void {
  let draining = false;
  app.decorate('beginDrain', () => {
    draining = true;
  });
  Object.defineProperty(app, 'draining', { get: () => draining });

  app.addHook('onRequest', async (request, reply) => {
    if (!draining || !isApiPath(request.url)) return;
    reply.header('connection', 'close');
    throw new LoopgateError('shutting_down', 'loopgate is shutting down and takes no new work; send the request again.');
  });

  // Answers given while draining close their connection, so that keep-alive sockets
  // of finished requests do not hold the server open until their idle timeout.
  app.addHook('onSend', async (_request, reply, payload) => {
    if (draining) reply.header('connection', 'close');
    return payload;
  });

  app.get('/readyz', async (_request, reply) => {
    reply.header('cache-control', 'no-store');
    if (draining) throw new LoopgateError('shutting_down', 'loopgate is shutting down.');
    const pressured = typeof app.isUnderPressure === 'function' && app.isUnderPressure();
    const saturated = pool.saturated;
    if (pressured || saturated) {
      reply.header('retry-after', '2');
      throw new LoopgateError('overloaded', pressured ? 'loopgate is shedding load (event loop or memory over its bound).' : 'Every compute worker is busy and the queue is full.');
    }
    return { status: 'ready', version: VERSION, computeWorkers: pool.options.size, computeWaiting: pool.waiting };
  });
}
