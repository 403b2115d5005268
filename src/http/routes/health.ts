import type { FastifyInstance } from 'fastify';
import { VERSION } from '../../version.js';

export async function healthRoutes(app: FastifyInstance): Promise<void> {
  app.get('/healthz', async () => ({ status: 'ok', version: VERSION }));
}
