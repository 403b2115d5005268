/**
 * Security headers (helmet) and CORS. The API answers JSON and SVG only, so
 * the default Content-Security-Policy allows nothing to run or load; the
 * HTML routes (the review page at /, reports) set their own, narrower
 * policies, which take precedence over this default because fastify writes
 * route headers last. CORS is off unless origins are configured.
 */
import cors from '@fastify/cors';
import helmet from '@fastify/helmet';
import type { FastifyInstance } from 'fastify';

export const API_CONTENT_SECURITY_POLICY = {
  defaultSrc: ["'none'"],
  baseUri: ["'none'"],
  formAction: ["'none'"],
  frameAncestors: ["'none'"],
};

export async function installSecurityHeaders(app: FastifyInstance, corsOrigins: readonly string[]): Promise<void> {
  await app.register(helmet, {
    global: true,
    contentSecurityPolicy: { useDefaults: false, directives: API_CONTENT_SECURITY_POLICY },
    // The review page embeds an SVG from a blob: URL; cross-origin isolation would break nothing else we serve.
    crossOriginEmbedderPolicy: false,
  });
  if (corsOrigins.length === 0) return;
  await app.register(cors, {
    origin: corsOrigins.includes('*') ? '*' : [...corsOrigins],
    methods: ['GET', 'POST'],
    allowedHeaders: ['content-type', 'authorization'],
    exposedHeaders: ['retry-after', 'x-ratelimit-limit', 'x-ratelimit-remaining', 'x-ratelimit-reset'],
    maxAge: 600,
  });
}
