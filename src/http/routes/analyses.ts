import type { FastifyInstance } from 'fastify';
import { isLightRequest } from '../compute-budget.js';
import { sendSerialized } from '../serialized-answer.js';

/** POST /v1/analyses: `analyze(body)`, run and serialised on the app's compute pool (worker threads with a time limit; see compute-pool.ts). */
export async function analysisRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/analyses', async (request, reply) => {
    const answer = await app.computePool.run('analyze', request.body, undefined, { light: isLightRequest(request) });
    return sendSerialized(request, reply, answer);
  });
}
