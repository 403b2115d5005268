/**
 * POST /v1/plots/{bode,nyquist,step}: the analysis request in, an SVG
 * figure out. `?closedLoop=false` leaves |S| and |T| off the Bode figure.
 * Drawn on the app's compute pool (worker threads with the time limit).
 */
import type { FastifyInstance } from 'fastify';

const SVG = 'image/svg+xml; charset=utf-8';

export async function plotRoutes(app: FastifyInstance): Promise<void> {
  app.post<{ Querystring: { closedLoop?: string } }>('/v1/plots/bode', async (request, reply) =>
    reply.type(SVG).send(await app.computePool.run('bodeFigure', request.body, { closedLoop: request.query.closedLoop !== 'false' })),
  );
  app.post('/v1/plots/nyquist', async (request, reply) => reply.type(SVG).send(await app.computePool.run('nyquistFigure', request.body)));
  app.post('/v1/plots/step', async (request, reply) => reply.type(SVG).send(await app.computePool.run('stepPlot', request.body)));
}
