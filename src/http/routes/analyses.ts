import type { FastifyInstance } from 'fastify';

/** POST /v1/analyses: `analyze(body)`, run on the app's compute pool (worker threads with a time limit; see compute-pool.ts). */
export async function analysisRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/analyses', async (request) => app.computePool.run('analyze', request.body));
}
