/**
 * GET /: the review page. Its one inline script is allowed by its SHA-256
 * hash in the Content-Security-Policy; nothing else may run, and it may
 * only talk to this server.
 */
import { createHash } from 'node:crypto';
import type { FastifyInstance } from 'fastify';
import { BOTTLING_PLANT_LOOPS } from '../../demo/bottling-plant.js';
import { REVIEW_PAGE_SCRIPT } from '../../render/page/review-page-script.js';
import { renderReviewPage } from '../../render/page/review-page.js';
import { VERSION } from '../../version.js';

const scriptHash = createHash('sha256').update(REVIEW_PAGE_SCRIPT, 'utf8').digest('base64');

export const PAGE_CONTENT_SECURITY_POLICY =
  `default-src 'none'; script-src 'sha256-${scriptHash}'; style-src 'unsafe-inline'; connect-src 'self'; img-src data:; frame-src 'self' blob:; base-uri 'none'; form-action 'none'`;

export async function pageRoutes(app: FastifyInstance): Promise<void> {
  const page = renderReviewPage(BOTTLING_PLANT_LOOPS, VERSION);
  app.get('/', async (_request, reply) =>
    reply.type('text/html; charset=utf-8').header('content-security-policy', PAGE_CONTENT_SECURITY_POLICY).send(page),
  );
}
