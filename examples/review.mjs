#!/usr/bin/env node
/**
 * Review two bottling-plant loops from JavaScript, twice: over HTTP with
 * fetch against a running loopgate service, and in-process with the
 * library's `analyze` export (no server). The two must agree; the script
 * says so, or exits 1 listing what differs.
 *
 *   - filler-pump speed loop: measured frequency-response sweep
 *     (examples/data/filler-pump-sweep.csv, demo data) under PI control;
 *   - pasteuriser temperature loop: transfer-function model with dead time
 *     under series PID control.
 *
 * The loops are the demo loops of src/demo/bottling-plant.ts (invented demo
 * numbers). An HTML report of each loop is saved via POST /v1/reports.
 *
 *   npm start                                  # in another terminal
 *   node examples/review.mjs [BASE_URL]        # HTTP and in-process
 *   node examples/review.mjs --in-process      # no server needed
 *
 * BASE_URL defaults to $LOOPGATE_URL, then http://127.0.0.1:8080. Reports go
 * to $LOOPGATE_REPORT_DIR (default: the current directory).
 *
 * Outside this repository the import is `import { analyze } from 'loopgate'`;
 * inside it the package cannot import itself by name, so it takes the build.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { analyze } from '../dist/index.js';

const args = process.argv.slice(2);
const inProcessOnly = args.includes('--in-process');
const baseUrl = (args.find((a) => /^https?:\/\//.test(a)) ?? process.env.LOOPGATE_URL ?? 'http://127.0.0.1:8080').replace(/\/+$/, '');
const reportDir = process.env.LOOPGATE_REPORT_DIR ?? '.';

const sweepCsv = await readFile(new URL('./data/filler-pump-sweep.csv', import.meta.url), 'utf8');

const LOOPS = [
  {
    name: 'filler-pump-speed',
    title: 'Filler-pump speed loop, measured sweep (PI, K = 3.5, Ti = 0.39 s)',
    request: {
      plant: {
        kind: 'frequency-response',
        csv: sweepCsv,
        frequencyUnit: 'Hz',
        magnitudeUnit: 'dB',
        phaseUnit: 'deg',
        averages: 16,
        // A pump on a motor is open-loop stable; saying so lets the Nyquist verdict rest on fact.
        openLoopUnstablePoles: 0,
      },
      controller: { kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 },
      detail: 'summary',
    },
  },
  {
    name: 'pasteuriser-temperature',
    title: 'Pasteuriser temperature loop, model (series PID, K = 1.9, Ti = 95 s, Td = 22 s, N = 10)',
    request: {
      // P(s) = 1.8·e^(−14 s)/((95 s + 1)(22 s + 1))
      plant: { kind: 'transfer-function', numerator: [1.8], denominator: [2090, 117, 1], delay: 14 },
      controller: { kind: 'pid', form: 'series', gain: 1.9, integralTime: 95, derivativeTime: 22, derivativeFilter: { n: 10 } },
      detail: 'summary',
    },
  },
];

/** An HTTP answer that is not 2xx: carries the status and the service's JSON error. */
class ServiceError extends Error {
  constructor(status, text) {
    let message = text.slice(0, 200);
    try {
      const e = JSON.parse(text);
      message = `${e.code}: ${e.message}` + (e.issues ?? []).map((i) => `\n  at ${i.path.join('.')}: ${i.message}`).join('');
    } catch {
      // not JSON: keep the start of the text
    }
    super(`HTTP ${status} ${message}`);
    this.status = status;
  }
}

async function post(path, body) {
  const response = await fetch(`${baseUrl}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  if (!response.ok) throw new ServiceError(response.status, await response.text());
  return response;
}

/** Four significant figures, trailing zeros kept (a reading, not a proof). */
const fmt = (x) => x.toPrecision(4);

function measuredNote(margin, unit, key) {
  const parts = [];
  if (margin.interpolationError) parts.push(`interpolation ±${fmt(margin.interpolationError[key])} ${unit}`);
  if (margin.uncertainty) parts.push(`uncertainty ±${fmt(margin.uncertainty[key])} ${unit}`);
  return parts.length ? `  [${parts.join(', ')}]` : '';
}

function printMargins(title, answer) {
  const { gain, phase, delay } = answer.margins;
  const ms = answer.peaks.sensitivity;
  const lines = [
    `== ${title}`,
    `request hash:      ${answer.requestHash}`,
    `closed loop:       ${answer.stability.closedLoopStable ? 'stable' : 'UNSTABLE'} (${answer.stability.method})`,
    gain
      ? `gain margin:       ${fmt(gain.db)} dB (ratio ${fmt(gain.ratio)}) at ${fmt(gain.frequency)} rad/s${measuredNote(gain, 'dB', 'db')}`
      : 'gain margin:       none (no phase crossover)',
    phase
      ? `phase margin:      ${fmt(phase.degrees)} deg at ${fmt(phase.frequency)} rad/s${measuredNote(phase, 'deg', 'degrees')}`
      : 'phase margin:      none (no gain crossover)',
    delay
      ? `delay margin:      ${fmt(delay.seconds)} s at ${fmt(delay.frequency)} rad/s${measuredNote(delay, 's', 'seconds')}`
      : 'delay margin:      none (no gain crossover with a positive phase margin)',
    `sensitivity peak:  Ms = ${fmt(ms.value)} (${fmt(ms.db)} dB)${ms.frequency === null ? '' : ` at ${fmt(ms.frequency)} rad/s`}`,
    `warnings:          ${answer.warnings.length ? answer.warnings.map((w) => w.code).join(', ') : 'none'}`,
    ...answer.warnings.map((w) => `  - ${w.message}`),
    '',
  ];
  console.log(lines.join('\n'));
}

/** The figures a review rests on; the service and the library must give the same ones. */
const figures = (a) => JSON.stringify({ requestHash: a.requestHash, stability: a.stability, margins: a.margins, peaks: a.peaks, bandwidth: a.bandwidth, warnings: a.warnings });

async function saveReport(loop) {
  let response;
  try {
    // The report carries the full responses and its plots, so no `detail` here.
    response = await post('/v1/reports', { plant: loop.request.plant, controller: loop.request.controller, report: { title: loop.title } });
  } catch (err) {
    if (err instanceof ServiceError && err.status === 404) {
      console.log(`report for ${loop.name}: not saved, this server has no POST /v1/reports (404)`);
      return;
    }
    throw err;
  }
  const path = join(reportDir, `${loop.name}-report.html`);
  await writeFile(path, Buffer.from(await response.arrayBuffer()));
  console.log(`report for ${loop.name}: saved to ${path}`);
}

async function main() {
  // In-process: the same answer as POST /v1/analyses, without a server.
  const local = LOOPS.map((loop) => analyze(loop.request));
  if (inProcessOnly) {
    console.log('-- in-process analyze()\n');
    LOOPS.forEach((loop, i) => printMargins(loop.title, local[i]));
    console.log(local[1].caution);
    return 0;
  }

  console.log(`-- POST ${baseUrl}/v1/analyses\n`);
  const remote = [];
  for (const loop of LOOPS) remote.push(await (await post('/v1/analyses', loop.request)).json());
  LOOPS.forEach((loop, i) => printMargins(loop.title, remote[i]));
  console.log(remote[1].caution + '\n');

  const differing = LOOPS.filter((_, i) => figures(local[i]) !== figures(remote[i])).map((l) => l.name);
  if (differing.length) {
    console.error(`in-process analyze() and the service differ for: ${differing.join(', ')} (versions ${local[0].version} and ${remote[0].version})`);
    return 1;
  }
  console.log('in-process analyze(): the same figures and request hashes as the service\n');

  for (const loop of LOOPS) await saveReport(loop);
  return 0;
}

try {
  process.exitCode = await main();
} catch (err) {
  if (err instanceof ServiceError) console.error(`loopgate refused the request: ${err.message}`);
  else if (err instanceof TypeError && err.cause) console.error(`cannot reach loopgate at ${baseUrl} (${err.cause.code ?? err.cause.message}); start it with \`npm start\` or pass its URL`);
  else console.error(err instanceof Error ? (err.stack ?? err.message) : err);
  process.exitCode = 1;
}
