/**
 * The benchmark's server: loopgate's own app (dist/, as `npm start` runs it,
 * with the logger off) plus one bench-only route, POST /bench/canned-analysis,
 * that parses the body like every route and answers a stored analysis of the
 * full-detail case: the rate at which this same server can merely parse and
 * serialise a response of that size, the ceiling for POST /v1/analyses.
 *
 * Started by bench/http.mjs with fork(); listens on 127.0.0.1 on a port the
 * system picks (BENCH_PORT to choose one) and reports it over IPC.
 */
import { analyze } from '../dist/contract/analyze.js';
import { buildApp } from '../dist/http/app.js';
import { FULL_RESPONSE_CASE } from './cases.mjs';

const options = { logger: false };
try {
  // Later versions of the app take their configuration from the environment (src/config).
  const { loadConfig } = await import('../dist/config/load-config.js');
  options.config = loadConfig(process.env);
} catch {
  // No configuration module yet: the app runs on its defaults.
}
const app = await buildApp(options);
const canned = analyze({ ...FULL_RESPONSE_CASE, detail: 'full' });
app.post('/bench/canned-analysis', async () => canned);
// As server.ts: the analysis workers start before the server listens.
await app.computePool?.warm?.();
const address = await app.listen({ host: '127.0.0.1', port: Number(process.env.BENCH_PORT ?? 0) });
const workers = options.config?.LOOPGATE_ANALYSIS_WORKERS ?? 'inline (app default)';
process.send?.({ address, cannedBytes: Buffer.byteLength(JSON.stringify(canned)), analysisWorkers: workers });
process.on('disconnect', () => app.close().then(() => process.exit(0)));
