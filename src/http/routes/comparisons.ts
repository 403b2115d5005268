import type { FastifyInstance } from 'fastify';
import { sendSerialized } from '../serialized-answer.js';

/** POST /v1/comparisons: two analyses of one plant, on the compute pool like /v1/analyses (same time limit, main thread kept free). */
export async function comparisonRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/comparisons', async (request, reply) => sendSerialized(request, reply, await app.computePool.run('compare', request.body)));
}
