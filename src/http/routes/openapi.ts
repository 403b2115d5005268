import type { FastifyInstance } from 'fastify';
import { buildOpenApiDocument } from '../openapi-document.js';

export async function openApiRoutes(app: FastifyInstance): Promise<void> {
  const document = JSON.stringify(buildOpenApiDocument());
  app.get('/openapi.json', async (_request, reply) => reply.type('application/json').send(document));
}
