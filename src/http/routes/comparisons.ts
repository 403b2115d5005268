import type { FastifyInstance } from 'fastify';
import { isLightRequest } from '../compute-budget.js';
import { sendSerialized } from '../serialized-answer.js';

/** POST /v1/comparisons: two analyses of one plant, on the compute pool like /v1/analyses (same time limit, main thread kept free). */
export async function comparisonRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/comparisons', async (request, reply) => {
    const answer = await app.computePool.run('compare', request.body, undefined, { light: isLightRequest(request) });
    return sendSerialized(request, reply, answer);
  });
}
