/**
 * Optional API keys. When keys are configured every /v1 request needs
 * `Authorization: Bearer <key>`: 401 `unauthorized` without one, 403
 * `forbidden` for a key that is not configured. Health, readiness, metrics,
 * OpenAPI and the page stay open.
 *
 * The comparison is constant-time: both sides are hashed with SHA-256 to
 * equal-length digests, compared with crypto.timingSafeEqual, and every
 * configured key is compared (no early exit), so the answer time says
 * nothing about how much of a key was right. A request only ever carries a
 * short fingerprint of its key (for rate limiting and logs), never the key.
 */
import { createHash, timingSafeEqual } from 'node:crypto';
import type { FastifyInstance } from 'fastify';
import { LoopgateError } from '../contract/errors.js';
import { isApiPath } from './protected-paths.js';

declare module 'fastify' {
  interface FastifyRequest {
    /** Fingerprint of the accepted API key (first 12 hex digits of its SHA-256), if any. */
    apiKeyId?: string;
  }
}

const digest = (text: string): Buffer => createHash('sha256').update(text, 'utf8').digest();

export const keyFingerprint = (key: string): string => digest(key).toString('hex').slice(0, 12);

/** The index of the matching key, or −1; compares against every key whatever the outcome. */
export function matchKey(candidate: string, keyDigests: readonly Buffer[]): number {
  const c = digest(candidate);
  let found = -1;
  for (let i = 0; i < keyDigests.length; i++) {
    if (timingSafeEqual(c, keyDigests[i]) && found < 0) found = i;
  }
  return found;
}

export function installApiKeys(app: FastifyInstance, keys: readonly string[]): void {
  if (keys.length === 0) return;
  const digests = keys.map(digest);
  const fingerprints = keys.map(keyFingerprint);
  app.addHook('onRequest', async (request, reply) => {
    if (!isApiPath(request.url)) return;
    const header = request.headers.authorization;
    const match = typeof header === 'string' ? /^Bearer[ ]+([\x21-\x7e]+)[ ]*$/i.exec(header) : null;
    if (!match) {
      reply.header('www-authenticate', 'Bearer realm="loopgate"');
      throw new LoopgateError('unauthorized', 'This service needs an API key: send the header "Authorization: Bearer <key>".');
    }
    const index = matchKey(match[1], digests);
    if (index < 0) throw new LoopgateError('forbidden', 'The API key is not accepted here; check it with whoever runs this service.');
    request.apiKeyId = fingerprints[index];
  });
}
