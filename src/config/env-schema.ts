/**
 * Every environment variable loopgate reads, with its default and meaning,
 * as one zod schema. Values are strings in the environment; each field
 * coerces and checks its own, so a typo stops the start with the variable
 * named rather than running with a surprise.
 */
import { availableParallelism } from 'node:os';
import { z } from 'zod';

const integer = (min: number, max: number, fallback: number) =>
  z
    .string()
    .trim()
    .regex(/^\d+$/, 'must be a whole number')
    .transform(Number)
    .pipe(z.number().int().min(min).max(max))
    .optional()
    .transform((v) => v ?? fallback);

const ratio = (fallback: number) =>
  z
    .string()
    .trim()
    .regex(/^\d*\.?\d+$/, 'must be a number between 0 and 1')
    .transform(Number)
    .pipe(z.number().min(0).max(1))
    .optional()
    .transform((v) => v ?? fallback);

const list = z
  .string()
  .optional()
  .transform((v) => (v ?? '').split(',').map((s) => s.trim()).filter((s) => s.length > 0));

const apiKeys = list.pipe(
  z.array(z.string().min(16, 'each key must have at least 16 characters').regex(/^[\x21-\x7e]+$/, 'keys are printable ASCII without spaces')),
);

function isOrigin(text: string): boolean {
  if (text === '*') return true;
  try {
    const u = new URL(text);
    return (u.protocol === 'http:' || u.protocol === 'https:') && u.origin === text.replace(/\/$/, '');
  } catch {
    return false;
  }
}

const corsOrigins = list.pipe(
  z.array(z.string().refine(isOrigin, 'each entry is * or an origin such as https://review.example.org (scheme, host, optional port, no path)')),
);

export const EnvSchema = z.object({
  HOST: z.string().trim().min(1).optional().transform((v) => v ?? '127.0.0.1'),
  PORT: integer(0, 65_535, 8080),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional().transform((v) => v ?? 'info'),
  LOOPGATE_API_KEYS: apiKeys,
  LOOPGATE_RATE_LIMIT_MAX: integer(0, 1_000_000, 0),
  LOOPGATE_RATE_LIMIT_WINDOW_MS: integer(1_000, 86_400_000, 60_000),
  LOOPGATE_CORS_ORIGINS: corsOrigins,
  LOOPGATE_REQUEST_TIMEOUT_MS: integer(100, 600_000, 15_000),
  LOOPGATE_SHUTDOWN_GRACE_MS: integer(0, 600_000, 10_000),
  LOOPGATE_ANALYSIS_WORKERS: integer(0, 64, Math.max(1, availableParallelism())),
  LOOPGATE_ANALYSIS_QUEUE: integer(0, 100_000, 64),
  LOOPGATE_MAX_WORK: integer(1_000, 1e12, 100_000_000),
  LOOPGATE_MAX_BATCH: integer(1, 100_000, 2_000),
  LOOPGATE_MAX_RECORD_LENGTH: integer(16, 100_000_000, 2_000_000),
  LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: integer(0, 60_000, 1_000),
  LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: ratio(0.98),
  LOOPGATE_MAX_HEAP_BYTES: integer(0, 1e12, 0),
  LOOPGATE_MAX_RSS_BYTES: integer(0, 1e12, 0),
  LOOPGATE_TRUST_PROXY: z.enum(['true', 'false']).optional().transform((v) => v === 'true'),
});

export type EnvInput = z.input<typeof EnvSchema>;
export type Env = z.output<typeof EnvSchema>;

/** What each variable means, for the README table and the start-up error message. */
export const ENV_DOCS: Record<keyof Env, string> = {
  HOST: 'Address to listen on (default 127.0.0.1).',
  PORT: 'Port to listen on, 0–65535 (default 8080; 0 picks a free port).',
  LOG_LEVEL: 'pino level: fatal, error, warn, info, debug, trace or silent (default info).',
  LOOPGATE_API_KEYS: 'Comma-separated API keys (≥ 16 printable characters each). When set, every /v1 route needs Authorization: Bearer <key>. Default: unset, no keys.',
  LOOPGATE_RATE_LIMIT_MAX: 'Requests per window per API key (or per client address without keys) on /v1 routes; 0 turns rate limiting off (default 0).',
  LOOPGATE_RATE_LIMIT_WINDOW_MS: 'Rate-limit window in ms (default 60000).',
  LOOPGATE_CORS_ORIGINS: 'Comma-separated origins allowed by CORS, or *; unset turns CORS off (default).',
  LOOPGATE_REQUEST_TIMEOUT_MS: 'Time limit of one request in ms: receiving it (node\'s requestTimeout) and, for work on the compute workers (analyses, checks — per chunk of 4 to 64 loops —, comparisons, plots, reports, estimates), waiting plus computing (503 analysis_timeout). Default 15000.',
  LOOPGATE_SHUTDOWN_GRACE_MS: 'On SIGTERM/SIGINT, how long in-flight requests may take before the process exits anyway with code 1 (default 10000).',
  LOOPGATE_ANALYSIS_WORKERS: 'Compute worker threads for POST /v1/analyses, /v1/checks, /v1/comparisons, /v1/plots/*, /v1/reports and /v1/estimates (default one per core); 0 runs that work on the main thread, where the time limit cannot interrupt it.',
  LOOPGATE_ANALYSIS_QUEUE: 'Computations allowed to wait for a compute worker; beyond, 503 overloaded (default 64).',
  LOOPGATE_MAX_WORK: 'Compute budget of one request: the sum over its loops of grid points × model order (default 1e8); beyond, 413 work_budget_exceeded.',
  LOOPGATE_MAX_BATCH: 'Loops in one request, over every route (default 2000; POST /v1/checks keeps its own 1000, too_many_loops); beyond, 413 batch_too_large.',
  LOOPGATE_MAX_RECORD_LENGTH: 'Longest array of numbers in a request (records, measured data; default 2000000); beyond, 413 record_too_long.',
  LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: 'Shed /v1 load with 503 overloaded when the event-loop delay exceeds this (ms; 0 off; default 1000).',
  LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: 'Shed /v1 load with 503 overloaded when event-loop utilisation exceeds this (0–1; 0 off; default 0.98).',
  LOOPGATE_MAX_HEAP_BYTES: 'Shed /v1 load when the V8 heap in use exceeds this many bytes (0 off, default).',
  LOOPGATE_MAX_RSS_BYTES: 'Shed /v1 load when the resident set exceeds this many bytes (0 off, default).',
  LOOPGATE_TRUST_PROXY: 'true: take the client address from X-Forwarded-For (behind a proxy; affects rate limiting by address). Default false.',
};
