/**
 * POST /v1/reports: the review report as a self-contained HTML page. The
 * page runs no scripts and loads nothing, and its Content-Security-Policy
 * says so.
 */
import type { FastifyInstance } from 'fastify';
import { reportHtml } from '../../contract/report.js';

export const REPORT_CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

export async function reportRoutes(app: FastifyInstance): Promise<void> {
  app.post('/v1/reports', async (request, reply) =>
    reply.type('text/html; charset=utf-8').header('content-security-policy', REPORT_CONTENT_SECURITY_POLICY).send(reportHtml(request.body)),
  );
}
