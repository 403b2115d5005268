/**
 * Everything that keeps the service up and truthful whatever callers send,
 * installed on the root app before the routes (order matters: headers
 * first, so that even a refusal carries them; then draining, load
 * shedding, API keys, rate limit, the compute budget; metrics and the log
 * line on every answer).
 */
import type { FastifyInstance } from 'fastify';
import type { Config } from '../config/load-config.js';
import { installApiKeys } from './api-keys.js';
import { ComputePool } from './compute-pool.js';
import { installComputeBudget } from './compute-budget.js';
import { installLifecycle } from './lifecycle.js';
import { installLoadShedding } from './load-shedding.js';
import { countTimeout, installMetrics } from './metrics.js';
import { installRateLimit } from './rate-limiting.js';
import { installRequestLogging } from './request-logging.js';
import { installSecurityHeaders } from './security.js';

declare module 'fastify' {
  interface FastifyInstance {
    /** Runs analyses (and other registered compute tasks) on worker threads with the time limit. */
    computePool: ComputePool;
  }
}

export async function installServiceGuards(app: FastifyInstance, config: Config): Promise<void> {
  const pool = new ComputePool({
    size: config.LOOPGATE_ANALYSIS_WORKERS,
    maxQueue: config.LOOPGATE_ANALYSIS_QUEUE,
    timeoutMs: config.LOOPGATE_REQUEST_TIMEOUT_MS,
    onTimeout: countTimeout,
  });
  app.decorate('computePool', pool);
  // Runs after the server stopped taking connections and in-flight requests were answered.
  app.addHook('onClose', async () => pool.close());

  await installSecurityHeaders(app, config.LOOPGATE_CORS_ORIGINS);
  installLifecycle(app, pool);
  await installLoadShedding(app, {
    maxEventLoopDelayMs: config.LOOPGATE_MAX_EVENT_LOOP_DELAY_MS,
    maxEventLoopUtilization: config.LOOPGATE_MAX_EVENT_LOOP_UTILIZATION,
    maxHeapBytes: config.LOOPGATE_MAX_HEAP_BYTES,
    maxRssBytes: config.LOOPGATE_MAX_RSS_BYTES,
  });
  installApiKeys(app, config.LOOPGATE_API_KEYS);
  await installRateLimit(app, config.LOOPGATE_RATE_LIMIT_MAX, config.LOOPGATE_RATE_LIMIT_WINDOW_MS);
  installComputeBudget(app, {
    maxWork: config.LOOPGATE_MAX_WORK,
    maxBatch: config.LOOPGATE_MAX_BATCH,
    maxRecordLength: config.LOOPGATE_MAX_RECORD_LENGTH,
  });
  installMetrics(app, () => pool.queued);
  installRequestLogging(app);
}
