/**
 * HTTP benchmark: autocannon against loopgate's app on 127.0.0.1 (a port of
 * its own), 16 connections, in one run:
 *   GET /healthz                       (the framework's own rate)
 *   POST /v1/analyses detail "summary"
 *   POST /v1/analyses detail "full"    (400 response points)
 *   POST /bench/canned-analysis        (same body, stored answer of the same size)
 *   POST /v1/checks with 1,000 loops   (batch, worker pool), and the same batch
 *                                      in-process on one thread and on the pool
 */
import { fork } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { FULL_RESPONSE_CASE, checkBatch } from './cases.mjs';
import { median } from './timing.mjs';

const SERVER = fileURLToPath(new URL('./bench-server.mjs', import.meta.url));

function startServer(env) {
  const child = fork(SERVER, [], {
    execArgv: (process.env.BENCH_SERVER_NODE_OPTIONS ?? '').split(' ').filter(Boolean),
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    env: { ...process.env, LOG_LEVEL: 'silent', ...env },
  });
  return new Promise((resolve, reject) => {
    child.once('message', (m) => resolve({ child, ...m }));
    child.once('exit', (code) => reject(new Error(`the bench server exited with code ${code}`)));
  });
}

function load(url, { seconds, connections = 16, method = 'GET', body }) {
  return autocannon({
    url,
    connections,
    duration: seconds,
    method,
    ...(body ? { body, headers: { 'content-type': 'application/json' } } : {}),
  });
}

/** Requests per second of one autocannon run, with its failures. */
async function rate(url, options) {
  const r = await load(url, options);
  // Only successful answers count: a 503 from load shedding is not an analysis.
  return {
    perSecond: r['2xx'] / r.duration,
    requests: r.requests.total,
    non2xx: r.non2xx,
    errors: r.errors + r.timeouts,
    latencyMs: { p50: r.latency.p50, p99: r.latency.p99 },
    bytesPerResponse: r.requests.total ? r.throughput.total / r.requests.total : 0,
  };
}

async function batch(base, seconds) {
  const body = JSON.stringify(checkBatch(1000));
  const post = async () => {
    const res = await fetch(`${base}/v1/checks`, { method: 'POST', headers: { 'content-type': 'application/json' }, body });
    const text = await res.text();
    return { status: res.status, text };
  };
  const first = await post();
  if (first.status === 404) return { available: false, reason: 'POST /v1/checks not available yet' };
  if (first.status !== 200) return { available: false, reason: `POST /v1/checks answered ${first.status}: ${first.text.slice(0, 200)}` };
  const times = [];
  const stop = Date.now() + seconds * 1000;
  while (times.length < 3 || Date.now() < stop) {
    const t0 = performance.now();
    const r = await post();
    if (r.status !== 200) return { available: false, reason: `POST /v1/checks answered ${r.status}` };
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const httpMs = times[times.length >> 1];

  // The same batch in-process: one thread (inline), then the worker pool, alternately.
  let inProcess = null;
  try {
    const { runChecks } = await import('../dist/gate/run-checks.js');
    const { LoopCheckPool } = await import('../dist/gate/worker-pool.js');
    const parsed = JSON.parse(body);
    const pool = new LoopCheckPool();
    const single = [];
    const pooled = [];
    // Warm-up: a fresh worker's compiler needs about five batches of 1,000 loops before the worker
    // checks as fast as the main thread (measured: 229 → 52 ms per batch), so it gets twice that.
    for (let i = 0; i < 10; i++) {
      await runChecks(parsed, { pool });
      await runChecks(parsed);
    }
    for (let i = 0; i < 7; i++) {
      let t0 = performance.now();
      await runChecks(parsed);
      single.push(performance.now() - t0);
      t0 = performance.now();
      await runChecks(parsed, { pool });
      pooled.push(performance.now() - t0);
    }
    await pool.close();
    inProcess = { singleThreadMs: median(single), poolMs: median(pooled), poolSize: pool.size };
  } catch (err) {
    inProcess = { error: String(err?.message ?? err) };
  }
  return { available: true, loops: 1000, httpMs, loopsPerSecond: 1000 / (httpMs / 1000), inProcess };
}

/**
 * The rates are measured in `rounds` rounds of the four loads back to back,
 * and each ratio is taken within a round, so a neighbour's burst of work on
 * a shared machine moves numerator and denominator together; the medians
 * over rounds are reported.
 */
export async function runHttp({ seconds = 5, rounds = 3, warmupSeconds = 5, env = {}, batch: withBatch = true } = {}) {
  const server = await startServer(env);
  const base = server.address;
  try {
    const summaryBody = JSON.stringify({ ...FULL_RESPONSE_CASE, detail: 'summary' });
    const fullBody = JSON.stringify({ ...FULL_RESPONSE_CASE, detail: 'full' });
    const loads = {
      health: [`${base}/healthz`, {}],
      summary: [`${base}/v1/analyses`, { method: 'POST', body: summaryBody }],
      full: [`${base}/v1/analyses`, { method: 'POST', body: fullBody }],
      canned: [`${base}/bench/canned-analysis`, { method: 'POST', body: fullBody }],
    };
    // Warm-up: long enough for the optimising compiler to finish on a busy machine.
    for (const [url, o] of Object.values(loads)) await load(url, { ...o, seconds: Math.max(1, warmupSeconds / 4) });
    const perRound = [];
    for (let r = 0; r < rounds; r++) {
      const round = {};
      for (const [name, [url, o]] of Object.entries(loads)) round[name] = await rate(url, { ...o, seconds });
      round.summaryOverHealth = round.summary.perSecond / round.health.perSecond;
      round.fullOverCanned = round.full.perSecond / round.canned.perSecond;
      perRound.push(round);
    }
    const pick = (name) => ({
      perSecond: median(perRound.map((r) => r[name].perSecond)),
      non2xx: perRound.reduce((a, r) => a + r[name].non2xx, 0),
      errors: perRound.reduce((a, r) => a + r[name].errors, 0),
      latencyMsP99: median(perRound.map((r) => r[name].latencyMs.p99)),
      bytesPerResponse: perRound[0][name].bytesPerResponse,
    });
    const checks = withBatch ? await batch(base, seconds) : null;
    return {
      address: base,
      connections: 16,
      seconds,
      rounds,
      cannedBytes: server.cannedBytes,
      analysisWorkers: server.analysisWorkers,
      health: pick('health'),
      summary: pick('summary'),
      full: pick('full'),
      canned: pick('canned'),
      summaryOverHealth: median(perRound.map((r) => r.summaryOverHealth)),
      fullOverCanned: median(perRound.map((r) => r.fullOverCanned)),
      perRound: perRound.map((r) => ({ summaryOverHealth: r.summaryOverHealth, fullOverCanned: r.fullOverCanned })),
      checks,
    };
  } finally {
    server.child.disconnect();
    await new Promise((resolve) => server.child.once('exit', resolve));
  }
}
