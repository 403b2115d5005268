/**
 * The fastify application: JSON body parsing with prototype-poisoning
 * protection, the error mapping, and the routes. Building it does not
 * listen; `server.ts` does, and tests use `app.inject`.
 */
import Fastify, { LogController, type FastifyInstance, type FastifyServerOptions } from 'fastify';
import { LIMITS } from '../contract/limits.js';
import { LoopgateError } from '../contract/errors.js';
import { installErrorHandling } from './error-handler.js';
import { defaultConfig, type Config } from '../config/load-config.js';
import { withRedaction } from './request-logging.js';
import { installServiceGuards } from './service-guards.js';
import { ROUTE_PLUGINS } from './routes/index.js';

export interface AppOptions {
  logger?: FastifyServerOptions['logger'];
  /**
   * Limits and switches (src/config). Without one: every default except that analyses run inline on the
   * main thread and load shedding is off (tests, embedding); server.ts passes the environment's.
   */
  config?: Config;
}

export async function buildApp(options: AppOptions = {}): Promise<FastifyInstance> {
  const config = options.config ?? { ...defaultConfig(), LOOPGATE_ANALYSIS_WORKERS: 0, LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: 0, LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: 0 };
  const app = Fastify({
    logger: withRedaction(options.logger ?? false),
    bodyLimit: LIMITS.maxBodyBytes,
    // One line per answer comes from request-logging.ts; fastify's two default lines would repeat it.
    logController: new LogController({ disableRequestLogging: true }),
    requestTimeout: config.LOOPGATE_REQUEST_TIMEOUT_MS,
    // While draining, lifecycle.ts answers 503 shutting_down in the catalogue's shape.
    return503OnClosing: false,
    trustProxy: config.LOOPGATE_TRUST_PROXY,
  });
  // JSON only: a text/plain body is refused with 415 rather than parsed as a string.
  app.removeContentTypeParser(['text/plain', 'application/json']);
  // Our own JSON parser, so that a syntax error is `invalid_json` and keys such as
  // __proto__ reach guardRawBody (JSON.parse keeps them as plain own keys; it
  // never sets a prototype), which refuses them with `forbidden_key`.
  app.addContentTypeParser('application/json', { parseAs: 'string' }, (_request, body, done) => {
    try {
      done(null, JSON.parse(body as string));
    } catch (err) {
      const detail = err instanceof Error ? err.message.slice(0, 120) : '';
      done(new LoopgateError('invalid_json', `The body is not valid JSON: ${detail}`), undefined);
    }
  });
  installErrorHandling(app);
  await installServiceGuards(app, config);
  for (const plugin of ROUTE_PLUGINS) await app.register(plugin);
  return app;
}
