import type { FastifyInstance } from 'fastify';
import { analyze } from '../../contract/analyze.js';

export async function analysisRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/analyses', async (request) => analyze(request.body));
}
