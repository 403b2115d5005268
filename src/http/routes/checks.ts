import type { FastifyInstance } from 'fastify';
import type { LoopTask } from '../../gate/check-loop.js';
import { GATE_LIMITS } from '../../gate/limits.js';
import type { ChunkRunner } from '../../gate/run-loop-tasks.js';
import { runChecks } from '../../gate/run-checks.js';
import { LoopCheckPool } from '../../gate/worker-pool.js';
import type { CheckResponse } from '../../contract/schemas/checks.js';
import { countVerdict } from '../metrics.js';

/**
 * POST /v1/checks. When the app computes on workers (LOOPGATE_ANALYSIS_WORKERS > 0), every batch,
 * however small, is checked in chunks on the app's compute pool: the event loop stays free, and
 * each chunk is under the request time limit (a pathological loop is stopped with 503
 * analysis_timeout, its worker replaced). With no compute workers (tests, embedding) the
 * library's behaviour stands: small batches inline, large ones on a LoopCheckPool of one thread
 * per core, started on first need and closed with the app.
 */
/** Every loop's verdict into loopgate_verdicts_total, then the answer as it is. */
function counted(answer: CheckResponse): CheckResponse {
  for (const loop of answer.loops) countVerdict(loop.verdict);
  return answer;
}

export async function checkRoutes(app: FastifyInstance): Promise<void> {
  const computePool = app.computePool;
  if (!computePool.inline) {
    const runner: ChunkRunner = {
      size: computePool.options.size,
      runChunk: (tasks: LoopTask[]) => computePool.run('checkChunk', tasks),
    };
    const options = { pool: runner, poolThreshold: 0 };
    app.post('/v1/checks', { bodyLimit: GATE_LIMITS.maxCheckBodyBytes }, async (request) => counted(await runChecks(request.body, options)));
    return;
  }
  let pool: LoopCheckPool | null = null;
  const poolOnDemand = () => (pool ??= new LoopCheckPool());
  app.addHook('onClose', async () => {
    await pool?.close();
  });
  app.post('/v1/checks', { bodyLimit: GATE_LIMITS.maxCheckBodyBytes }, async (request) => counted(await runChecks(request.body, { pool: poolOnDemand })));
}
