import type { FastifyInstance } from 'fastify';
import { sendSerialized } from '../serialized-answer.js';

/** POST /v1/analyses: `analyze(body)`, run and serialised on the app's compute pool (worker threads with a time limit; see compute-pool.ts). */
export async function analysisRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/analyses', async (request, reply) => sendSerialized(request, reply, await app.computePool.run('analyze', request.body)));
}
