/**
 * Fuzzing every route of ROUTES with mutated and random bodies (fast-check,
 * fixed seed; FUZZ_SEED and FUZZ_RUNS override): whatever comes in, the
 * answer is never a 500, never takes over 2 s, never crashes the process,
 * and every 4xx/5xx is JSON with statusCode, a catalogue code and a message.
 *
 * The app runs as deployed: computations on two worker threads with a
 * 1.2 s time limit (a 503 analysis_timeout is a correct, timely answer),
 * two requests in flight at a time so that both cores work.
 */
import fc from 'fast-check';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ERROR_CATALOGUE } from '../../../src/contract/errors.js';
import { buildApp } from '../../../src/http/app.js';
import { ROUTES } from '../../../src/http/route-table.js';
import { ensureBuilt, testConfig } from '../support/service-config.js';
import { mutate, planArb, specialValue } from './mutate.js';
import { ALL_SEEDS, SEEDS } from './seed-bodies.js';

const SEED = Number(process.env.FUZZ_SEED ?? 20_261_201);
/** The base number of requests per route, scaled by share(): about 20,000 in all at the default. */
const RUNS = Number(process.env.FUZZ_RUNS ?? 2_000);

/**
 * Routes that simulate time responses (the step plot, the report) cost tens of
 * milliseconds per valid body: they get a fifth of the base, other POST routes
 * 70 %, GET routes (fast whatever they are sent) 90 %.
 */
const SLOW_ROUTES = new Set(['/v1/plots/step', '/v1/reports']);
const share = (r: { method: string; path: string }) => (SLOW_ROUTES.has(r.path) ? 0.2 : r.method === 'POST' ? 0.7 : 0.9);
const MAX_MS = 2_000;

let app: FastifyInstance;
const statuses = new Map<number, number>();
let total = 0;
let timeouts = 0;

const IN_FLIGHT = 2;

beforeAll(async () => {
  ensureBuilt();
  app = await buildApp({ config: testConfig({ LOOPGATE_ANALYSIS_WORKERS: 2, LOOPGATE_ANALYSIS_QUEUE: 1_000, LOOPGATE_REQUEST_TIMEOUT_MS: 1_200 }) });
  await app.computePool.warm();
}, 240_000);
afterAll(async () => {
  await app.close();
  console.log(`fuzz: ${total} requests, statuses ${JSON.stringify(Object.fromEntries([...statuses].sort()))}, ${timeouts} stopped at the time limit, seed ${SEED}`);
});

const CODES = new Set([...Object.keys(ERROR_CATALOGUE), 'not_found']);

async function send(method: string, url: string, payload: string | undefined, contentType: string | undefined) {
  const headers: Record<string, string> = {};
  if (contentType !== undefined) headers['content-type'] = contentType;
  const started = performance.now();
  const res = await app.inject({ method: method as 'GET', url, payload, headers });
  const ms = performance.now() - started;
  total++;
  statuses.set(res.statusCode, (statuses.get(res.statusCode) ?? 0) + 1);
  const where = `${method} ${url} ${contentType ?? '(no type)'} ${(payload ?? '').slice(0, 300)}`;
  expect(ms, `took ${ms.toFixed(0)} ms: ${where}`).toBeLessThan(MAX_MS);
  expect(res.statusCode, `${res.body.slice(0, 300)} for ${where}`).not.toBe(500);
  expect(res.statusCode).toBeLessThan(600);
  if (res.statusCode >= 400) {
    const body = res.json() as { statusCode: unknown; code: unknown; message: unknown };
    if (body.code === 'analysis_timeout') timeouts++;
    expect(body.statusCode, where).toBe(res.statusCode);
    expect(CODES.has(String(body.code)), `unknown code ${String(body.code)} for ${where}`).toBe(true);
    expect(typeof body.message === 'string' && body.message.length > 0, where).toBe(true);
  }
}

describe.each(ROUTES.filter((r) => r.method === 'POST'))('fuzz POST $path', (route) => {
  const seeds = SEEDS[route.path] ?? ALL_SEEDS;
  it('answers every mutated body with a documented 2xx/4xx, in time', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(fc.nat(), planArb), { minLength: IN_FLIGHT, maxLength: IN_FLIGHT }), async (group) => {
        await Promise.all(
          group.map(([which, plan]) => {
            const m = mutate(seeds[which % seeds.length], plan);
            return send('POST', route.path, m.text, m.contentType);
          }),
        );
      }),
      { numRuns: Math.ceil((RUNS * share(route)) / IN_FLIGHT), seed: SEED, endOnFailure: true },
    );
  });
});

describe.each(ROUTES.filter((r) => r.method === 'GET'))('fuzz GET $path', (route) => {
  it('answers odd queries, bodies and methods without a fault', async () => {
    const query = fc.dictionary(fc.string({ maxLength: 12 }), fc.oneof(fc.string({ maxLength: 30 }), specialValue.map(String)), { maxKeys: 4 });
    await fc.assert(
      fc.asyncProperty(query, fc.nat(), planArb, async (q, which, plan) => {
        const search = new URLSearchParams(q as Record<string, string>).toString();
        const url = search ? `${route.path}?${search}` : route.path;
        if (plan.pick % 3 === 0) {
          const m = mutate(ALL_SEEDS[which % ALL_SEEDS.length], plan);
          await send(plan.pick % 2 ? 'POST' : 'PUT', url, m.text, m.contentType);
        } else {
          await send('GET', url, undefined, undefined);
        }
      }),
      { numRuns: Math.ceil(RUNS * share(route)), seed: SEED, endOnFailure: true },
    );
  });
});

describe('after the fuzz run', () => {
  it('the process still answers, and at least 20,000 requests were sent at the default settings', async () => {
    expect((await app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
    if (!process.env.FUZZ_RUNS) expect(total).toBeGreaterThanOrEqual(20_000);
  });
});
