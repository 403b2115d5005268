import type { FastifyInstance } from 'fastify';
import { sendSerialized } from '../serialized-answer.js';

/** Two records of up to 2,000,000 samples as JSON text: about 50 MB; this route alone accepts that much. */
export const ESTIMATE_BODY_LIMIT = 128 * 1024 * 1024;

/** POST /v1/estimates, estimated on the app's compute pool (worker threads with the time limit). */
export async function estimateRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/estimates', { bodyLimit: ESTIMATE_BODY_LIMIT }, async (request, reply) =>
    sendSerialized(request, reply, await app.computePool.run('estimate', request.body)),
  );
}
