import type { FastifyInstance } from 'fastify';

/** POST /v1/comparisons: two analyses of one plant, on the compute pool like /v1/analyses (same time limit, main thread kept free). */
export async function comparisonRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/comparisons', async (request) => app.computePool.run('compare', request.body));
}
