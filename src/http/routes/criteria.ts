import type { FastifyInstance } from 'fastify';
import { describeCriteria } from '../../gate/describe-criteria.js';

export async function criteriaRoutes(app: FastifyInstance): Promise<void> {
  const answer = describeCriteria();
  app.get('/v1/criteria', async () => answer);
}
