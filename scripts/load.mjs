#!/usr/bin/env node
// `npm run load`: a bounded load test of the built server on 127.0.0.1 only.
// Starts `node dist/server.js` on a free port, drives POST /v1/analyses with
// autocannon at several concurrencies for a fixed time each, twice over, and
// reports throughput, latency percentiles, status counts, errors and the
// server's resident memory before and after (from GET /metrics). Fails
// (exit 1) on any answer other than 200 or a deliberate 503, on connection
// errors or time-outs, or when memory grows from the first round to the
// second by more than LOAD_MAX_GROWTH_MB (default 40). Then sends SIGTERM
// and expects a clean exit.
//
// Settings: LOAD_SECONDS (per step, default 6), LOAD_CONNECTIONS (default
// "4,16,64"), LOAD_ROUNDS (default 2), LOAD_QUEUE (the server's analysis
// queue bound, default 16, small so that saturation sheds visibly),
// LOAD_LOG_LEVEL (the server's, default info).
import { execFileSync, spawn } from 'node:child_process';
import autocannon from 'autocannon';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 6);
const CONNECTIONS = (process.env.LOAD_CONNECTIONS ?? '4,16,64').split(',').map(Number);
const ROUNDS = Number(process.env.LOAD_ROUNDS ?? 2);
const MAX_GROWTH_MB = Number(process.env.LOAD_MAX_GROWTH_MB ?? 40);

// The filler-pump speed loop of the bottling plant, summary detail.
const BODY = JSON.stringify({
  plant: { kind: 'transfer-function', numerator: [0.92], denominator: [0.028, 0.43, 1], delay: 0.02 },
  controller: { kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 },
  detail: 'summary',
});

execFileSync(process.execPath, ['scripts/build-if-needed.mjs'], { stdio: 'inherit' });

const server = spawn(process.execPath, ['dist/server.js'], {
  env: { ...process.env, HOST: '127.0.0.1', PORT: '0', LOG_LEVEL: process.env.LOAD_LOG_LEVEL ?? 'info', LOOPGATE_ANALYSIS_QUEUE: process.env.LOAD_QUEUE ?? '16' },
  stdio: ['ignore', 'pipe', 'inherit'],
});
const exited = new Promise((resolve) => server.once('exit', (code) => resolve(code)));
const base = await new Promise((resolve, reject) => {
  let out = '';
  const timer = setTimeout(() => {
    server.kill('SIGKILL');
    reject(new Error('the server did not start within 60 s'));
  }, 60_000);
  server.stdout.on('data', (d) => {
    out += d;
    const m = /Server listening at (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
    if (m) {
      clearTimeout(timer);
      resolve(m[1]);
    }
  });
  exited.then((code) => reject(new Error(`the server exited with ${code}`)));
});
if (!/^http:\/\/127\.0\.0\.1:/.test(base)) throw new Error('refusing to load anything but 127.0.0.1');
// The server's log lines (one JSON line per answer at info, as in production) are read and dropped.
server.stdout.removeAllListeners('data');
server.stdout.resume();

async function residentMb() {
  const text = await (await fetch(`${base}/metrics`)).text();
  const m = /^process_resident_memory_bytes (\d+(?:\.\d+)?(?:e\+\d+)?)/m.exec(text);
  return m ? Number(m[1]) / 2 ** 20 : NaN;
}

function run(connections) {
  return autocannon({
    url: `${base}/v1/analyses`,
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: BODY,
    connections,
    duration: SECONDS,
    timeout: 10,
  });
}

const rows = [];
const rss = [await residentMb()];
let failed = false;
for (let round = 1; round <= ROUNDS; round++) {
  for (const connections of CONNECTIONS) {
    const r = await run(connections);
    const statuses = Object.fromEntries(Object.entries(r.statusCodeStats ?? {}).map(([k, v]) => [k, v.count]));
    const unexpected = Object.keys(statuses).filter((s) => s !== '200' && s !== '503');
    if (unexpected.length || r.errors || r.timeouts) failed = true;
    rows.push({
      round,
      connections,
      'req/s': Math.round(r.requests.average),
      'p50 ms': r.latency.p50,
      'p90 ms': r.latency.p90,
      'p99 ms': r.latency.p99,
      'max ms': r.latency.max,
      '200': statuses['200'] ?? 0,
      '503': statuses['503'] ?? 0,
      other: unexpected.map((s) => `${s}:${statuses[s]}`).join(' ') || 0,
      errors: r.errors,
      timeouts: r.timeouts,
    });
  }
  rss.push(await residentMb());
}

console.table(rows);
const growth = rss[rss.length - 1] - rss[1];
console.log(`resident memory, MB: before ${rss[0].toFixed(1)}, after each round ${rss.slice(1).map((x) => x.toFixed(1)).join(', ')}; growth from round 1 to round ${ROUNDS}: ${growth.toFixed(1)} MB (limit ${MAX_GROWTH_MB})`);
if (ROUNDS > 1 && growth > MAX_GROWTH_MB) failed = true;

server.kill('SIGTERM');
const code = await exited;
console.log(`server exit code after SIGTERM: ${code}`);
if (code !== 0) failed = true;
console.log(failed ? 'load: FAILED (see above)' : 'load: passed (only 200 and deliberate 503 answers, no errors, memory steady)');
process.exit(failed ? 1 : 0);
