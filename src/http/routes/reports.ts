/**
 * POST /v1/reports: the review report as a self-contained HTML page. The
 * page runs no scripts and loads nothing, and its Content-Security-Policy
 * says so. Built on the app's compute pool (worker threads with the time limit).
 */
import type { FastifyInstance } from 'fastify';

export const REPORT_CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

export async function reportRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/reports', async (request, reply) =>
    reply.type('text/html; charset=utf-8').header('content-security-policy', REPORT_CONTENT_SECURITY_POLICY).send(await app.computePool.run('report', request.body)),
  );
}
