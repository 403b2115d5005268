/**
 * Prometheus metrics (prom-client) on one registry of our own: requests and
 * their durations per route and status, analyses per plant kind, verdicts
 * per outcome, compute-pool timeouts and queue, and prom-client's process
 * metrics (event-loop lag among them). Routes elsewhere count through
 * `countVerdict(outcome)` (routes/checks.ts, one per loop) and `countAnalysis(kind)`; the counters are
 * module-level, so every app in a process adds to the same series.
 */
import type { FastifyInstance } from 'fastify';
import { collectDefaultMetrics, Counter, Gauge, Histogram, Registry } from 'prom-client';

export const metricsRegistry = new Registry();
let defaultsStarted = false;

const requests = new Counter({
  name: 'loopgate_http_requests_total',
  help: 'HTTP requests answered, by method, route template and status.',
  labelNames: ['method', 'route', 'status'] as const,
  registers: [metricsRegistry],
});

const durations = new Histogram({
  name: 'loopgate_http_request_duration_seconds',
  help: 'Time from receiving a request to finishing its answer, by method, route template and status.',
  labelNames: ['method', 'route', 'status'] as const,
  buckets: [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30],
  registers: [metricsRegistry],
});

const analyses = new Counter({
  name: 'loopgate_analyses_total',
  help: 'Loops analysed with an answer (200), by plant kind.',
  labelNames: ['plant_kind'] as const,
  registers: [metricsRegistry],
});

const verdicts = new Counter({
  name: 'loopgate_verdicts_total',
  help: 'Loop verdicts given by POST /v1/checks, by outcome (pass, warn, fail).',
  labelNames: ['outcome'] as const,
  registers: [metricsRegistry],
});

const timeouts = new Counter({
  name: 'loopgate_compute_timeouts_total',
  help: 'Computations stopped at the time limit (answered 503 analysis_timeout).',
  registers: [metricsRegistry],
});

export const computeQueue = new Gauge({
  name: 'loopgate_compute_waiting',
  help: 'Computations no worker thread has taken yet (every worker busy and its inbox full).',
  registers: [metricsRegistry],
});

// Label values come from callers' bodies: keep them short and few.
const label = (text: string): string => (/^[a-z0-9_-]{1,40}$/i.test(text) ? text : 'other');

/** Counts one verdict of the gate, e.g. countVerdict('pass'). */
export function countVerdict(outcome: string): void {
  verdicts.inc({ outcome: label(outcome) });
}

/** Counts one analysed loop of the given plant kind. */
export function countAnalysis(plantKind: string): void {
  analyses.inc({ plant_kind: label(plantKind) });
}

export function countTimeout(): void {
  timeouts.inc();
}

export function installMetrics(app: FastifyInstance, waiting: () => number): void {
  if (!defaultsStarted) {
    collectDefaultMetrics({ register: metricsRegistry, eventLoopMonitoringPrecision: 10 });
    defaultsStarted = true;
  }
  app.addHook('onResponse', async (request, reply) => {
    // The route template, not the URL, so that unknown paths cannot create series without end.
    const route = request.routeOptions.url ?? 'unmatched';
    const labels = { method: request.method, route, status: String(reply.statusCode) };
    requests.inc(labels);
    durations.observe(labels, reply.elapsedTime / 1000);
    if (reply.statusCode === 200) for (const loop of request.workEstimate?.loops ?? []) countAnalysis(loop.kind);
  });
  app.get('/metrics', async (_request, reply) => {
    computeQueue.set(waiting());
    return reply.type(metricsRegistry.contentType).send(await metricsRegistry.metrics());
  });
}
