import type { FastifyInstance } from 'fastify';
import { GATE_LIMITS } from '../../gate/limits.js';
import { runChecks } from '../../gate/run-checks.js';
import { LoopCheckPool } from '../../gate/worker-pool.js';

/** POST /v1/checks. Large batches run on this app's own worker pool, started on first need and closed with the app. */
export async function checkRoutes(app: FastifyInstance): Promise<void> {
  let pool: LoopCheckPool | null = null;
  const poolOnDemand = () => (pool ??= new LoopCheckPool());
  app.addHook('onClose', async () => {
    await pool?.close();
  });
  app.post('/v1/checks', { bodyLimit: GATE_LIMITS.maxCheckBodyBytes }, async (request) => runChecks(request.body, { pool: poolOnDemand }));
}
