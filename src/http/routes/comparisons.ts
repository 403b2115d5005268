import type { FastifyInstance } from 'fastify';
import { compareTunings } from '../../gate/compare-tunings.js';

export async function comparisonRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/comparisons', async (request) => compareTunings(request.body));
}
