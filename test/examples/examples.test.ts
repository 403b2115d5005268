/**
 * The examples under examples/ run here, as their readers would run them,
 * against the built server (dist/server.js on a free port of its own), so
 * they cannot rot: exit codes, the figures they print (equal, at the
 * printed precision, to what POST /v1/analyses answers for the same
 * request, which the request hash they print proves), the reports they
 * save, and the JUnit file of the CI gate.
 *
 * The expected values come from the service itself: these tests check that
 * the examples send what they say and read the answer faithfully, not the
 * analysis (test/reference does that).
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { XMLParser } from 'fast-xml-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SAFETY_CAUTION } from '../../src/contract/caution.js';
import { FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP } from '../../src/demo/bottling-plant.js';

const ROOT = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const EXAMPLES = join(ROOT, 'examples');
const SWEEP_CSV = join(EXAMPLES, 'data', 'filler-pump-sweep.csv');
const BATCH_FILE = join(EXAMPLES, 'data', 'bottling-plant-loops.json');

const hasPython = spawnSync('python3', ['--version']).status === 0;
const hasCli = existsSync(join(ROOT, 'dist', 'cli', 'main.js'));

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

function run(command: string, args: string[], env: Record<string, string> = {}): Promise<Run> {
  return new Promise((done, fail) => {
    const child = spawn(command, args, { cwd: ROOT, env: { ...process.env, ...env } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('error', fail);
    child.on('close', (code) => done({ code, stdout, stderr }));
  });
}

function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => done(port));
    });
  });
}

let server: ChildProcess | undefined;
let serverLog = '';
let baseUrl = '';
let reportsRoute = false;
let work = '';

async function post(path: string, body: unknown): Promise<{ status: number; json: any }> {
  const response = await fetch(`${baseUrl}${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  const text = await response.text();
  return { status: response.status, json: response.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text };
}

beforeAll(async () => {
  if (!existsSync(join(ROOT, 'dist', 'server.js'))) throw new Error('dist/server.js is missing: `npm test` builds it; alone, run `npm run build` first');
  const port = await freePort();
  baseUrl = `http://127.0.0.1:${port}`;
  server = spawn(process.execPath, ['dist/server.js'], { cwd: ROOT, env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'warn' } });
  server.stdout?.on('data', (d) => (serverLog += d));
  server.stderr?.on('data', (d) => (serverLog += d));
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (server.exitCode !== null) throw new Error(`the server exited with ${server.exitCode}:\n${serverLog}`);
    try {
      if ((await fetch(`${baseUrl}/healthz`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`the server did not answer /healthz within 30 s:\n${serverLog}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  // The report route is being built alongside; the examples say when it is missing, and so do these tests.
  reportsRoute = (await post('/v1/reports', { plant: PASTEURISER_TEMPERATURE_LOOP.request.plant, controller: PASTEURISER_TEMPERATURE_LOOP.request.controller })).status !== 404;
  work = mkdtempSync(join(tmpdir(), 'loopgate-examples-'));
});

afterAll(async () => {
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server!.once('exit', r));
    server.kill('SIGTERM');
    await exited;
  }
  if (work) rmSync(work, { recursive: true, force: true });
});

/** The requests the notebook and JavaScript examples say they send, built here from the demo module. */
function exampleRequests() {
  return [
    {
      name: 'filler-pump-speed',
      request: {
        plant: {
          kind: 'frequency-response',
          csv: readFileSync(SWEEP_CSV, 'utf8'),
          frequencyUnit: 'Hz',
          magnitudeUnit: 'dB',
          phaseUnit: 'deg',
          averages: 16,
          openLoopUnstablePoles: 0,
        },
        controller: FILLER_PUMP_SPEED_LOOP.request.controller,
        detail: 'summary',
      },
    },
    { name: 'pasteuriser-temperature', request: { ...PASTEURISER_TEMPERATURE_LOOP.request, detail: 'summary' } },
  ];
}

/** The printed block of each loop: its "== title" line and the lines after it, up to the blank line. */
function sections(stdout: string): string[][] {
  const lines = stdout.split('\n');
  return lines.flatMap((line, i) => {
    if (!line.startsWith('== ')) return [];
    const end = lines.indexOf('', i);
    return [lines.slice(i, end === -1 ? undefined : end)];
  });
}

function field(lines: string[], label: string): string {
  const line = lines.find((l) => l.startsWith(`${label}:`));
  expect(line, `a "${label}:" line in\n${lines.join('\n')}`).toBeDefined();
  return line!.slice(label.length + 1).trim();
}

/** A printed reading equals the service's figure rounded to four significant figures. */
function expectReading(printed: string | undefined, exact: number) {
  expect(printed).toBeDefined();
  expect(Number(printed)).toBe(Number(exact.toPrecision(4)));
}

const NUM = String.raw`(-?[\d.]+(?:e[+-]?\d+)?)`;

function expectMeasuredNote(line: string, margin: any, unit: string, key: string) {
  if (!margin.interpolationError) {
    expect(line).not.toContain('[');
    return;
  }
  const note = line.match(new RegExp(String.raw`\[interpolation ±${NUM} ${unit}, uncertainty ±${NUM} ${unit}\]$`));
  expect(note, line).not.toBeNull();
  expectReading(note![1], margin.interpolationError[key]);
  expectReading(note![2], margin.uncertainty[key]);
}

/** Every figure the example printed for one loop against the service's answer. */
function expectPrintedAnswer(lines: string[], answer: any) {
  expect(field(lines, 'request hash')).toBe(answer.requestHash);
  expect(field(lines, 'closed loop')).toBe(`${answer.stability.closedLoopStable ? 'stable' : 'UNSTABLE'} (${answer.stability.method})`);
  const { gain, phase, delay } = answer.margins;

  const gainLine = field(lines, 'gain margin');
  if (gain === null) expect(gainLine).toMatch(/^none/);
  else {
    const m = gainLine.match(new RegExp(String.raw`^${NUM} dB \(ratio ${NUM}\) at ${NUM} rad/s`));
    expect(m, gainLine).not.toBeNull();
    expectReading(m![1], gain.db);
    expectReading(m![2], gain.ratio);
    expectReading(m![3], gain.frequency);
    expectMeasuredNote(gainLine, gain, 'dB', 'db');
  }
  const phaseLine = field(lines, 'phase margin');
  if (phase === null) expect(phaseLine).toMatch(/^none/);
  else {
    const m = phaseLine.match(new RegExp(String.raw`^${NUM} deg at ${NUM} rad/s`));
    expect(m, phaseLine).not.toBeNull();
    expectReading(m![1], phase.degrees);
    expectReading(m![2], phase.frequency);
    expectMeasuredNote(phaseLine, phase, 'deg', 'degrees');
  }
  const delayLine = field(lines, 'delay margin');
  if (delay === null) expect(delayLine).toMatch(/^none/);
  else {
    const m = delayLine.match(new RegExp(String.raw`^${NUM} s at ${NUM} rad/s`));
    expect(m, delayLine).not.toBeNull();
    expectReading(m![1], delay.seconds);
    expectReading(m![2], delay.frequency);
    expectMeasuredNote(delayLine, delay, 's', 'seconds');
  }
  const msLine = field(lines, 'sensitivity peak');
  const ms = msLine.match(new RegExp(String.raw`^Ms = ${NUM} \(${NUM} dB\)(?: at ${NUM} rad/s)?$`));
  expect(ms, msLine).not.toBeNull();
  expectReading(ms![1], answer.peaks.sensitivity.value);
  expectReading(ms![2], answer.peaks.sensitivity.db);
  if (answer.peaks.sensitivity.frequency === null) expect(ms![3]).toBeUndefined();
  else expectReading(ms![3], answer.peaks.sensitivity.frequency);
  const codes = answer.warnings.map((w: { code: string }) => w.code);
  expect(field(lines, 'warnings')).toBe(codes.length ? codes.join(', ') : 'none');
}

/** Both loops printed as the service answers them, in order; the caution printed once. */
async function expectPrintedLoops(stdout: string) {
  const printed = sections(stdout);
  const requests = exampleRequests();
  expect(printed).toHaveLength(requests.length);
  for (const [i, { request }] of requests.entries()) {
    const { status, json } = await post('/v1/analyses', request);
    expect(status).toBe(200);
    expectPrintedAnswer(printed[i], json);
  }
  expect(stdout).toContain(SAFETY_CAUTION);
}

/** The reports saved in `dir`, or the message saying the route is missing. */
function expectReports(stdout: string, dir: string) {
  // Where the source has the report route, the built server must answer it; the skip message is for servers without it.
  expect(reportsRoute).toBe(existsSync(join(ROOT, 'src', 'http', 'routes', 'reports.ts')));
  for (const { name } of exampleRequests()) {
    const path = join(dir, `${name}-report.html`);
    if (reportsRoute) {
      expect(stdout).toContain(`report for ${name}: saved to ${path}`);
      const html = readFileSync(path, 'utf8');
      expect(html).toMatch(/<html/i);
      expect(html).toContain(SAFETY_CAUTION);
    } else {
      expect(stdout).toContain(`report for ${name}: not saved, this server has no POST /v1/reports (404)`);
      expect(existsSync(path)).toBe(false);
    }
  }
}

describe('demo data', () => {
  it.skipIf(!hasPython)('the committed sweep CSV is what its committed generator writes', () => {
    const generated = spawnSync('python3', [join(EXAMPLES, 'data', 'make-filler-pump-sweep.py')], { encoding: 'utf8' });
    expect(generated.status, generated.stderr).toBe(0);
    expect(generated.stdout).toBe(readFileSync(SWEEP_CSV, 'utf8'));
  });

  it('the sweep CSV says it is demo data', () => {
    expect(readFileSync(SWEEP_CSV, 'utf8').split('\n')[0]).toMatch(/^# DEMO DATA/);
  });

  it("the batch file's first two loops are the demo loops, the third a retune of the filler pump", () => {
    const batch = JSON.parse(readFileSync(BATCH_FILE, 'utf8'));
    expect(batch.loops.map((l: { name: string }) => l.name)).toEqual(['filler-pump-speed', 'pasteuriser-temperature', 'filler-pump-speed-fragile-retune']);
    const [pump, pasteuriser, retune] = batch.loops;
    // The JSON writes the pump's (0.35 s + 1)(0.08 s + 1) as 0.028 s² + 0.43 s + 1; the module multiplies it out in floating point.
    const expectSamePlant = (actual: any, expected: any) => {
      expect({ ...actual, denominator: undefined }).toEqual({ ...expected, denominator: undefined });
      expect(actual.denominator).toHaveLength(expected.denominator.length);
      actual.denominator.forEach((c: number, i: number) => expect(c).toBeCloseTo(expected.denominator[i], 12));
    };
    expectSamePlant(pump.plant, FILLER_PUMP_SPEED_LOOP.request.plant);
    expect(pump.controller).toEqual(FILLER_PUMP_SPEED_LOOP.request.controller);
    expectSamePlant(pasteuriser.plant, PASTEURISER_TEMPERATURE_LOOP.request.plant);
    expect(pasteuriser.controller).toEqual(PASTEURISER_TEMPERATURE_LOOP.request.controller);
    expect(retune.plant).toEqual(pump.plant);
    expect(retune.controller).not.toEqual(pump.controller);
  });
});

describe.skipIf(!hasPython)('examples/notebook_client.py', () => {
  it('prints the margins the service answers for the same requests and saves the reports (or says why not)', async () => {
    const dir = mkdtempSync(join(work, 'py-'));
    const result = await run('python3', [join(EXAMPLES, 'notebook_client.py'), baseUrl], { LOOPGATE_REPORT_DIR: dir, LOOPGATE_URL: '' });
    expect(result.code, result.stderr).toBe(0);
    await expectPrintedLoops(result.stdout);
    expectReports(result.stdout, dir);
  });

  it('takes the base URL from LOOPGATE_URL', async () => {
    const dir = mkdtempSync(join(work, 'py-env-'));
    const result = await run('python3', [join(EXAMPLES, 'notebook_client.py')], { LOOPGATE_REPORT_DIR: dir, LOOPGATE_URL: baseUrl });
    expect(result.code, result.stderr).toBe(0);
    await expectPrintedLoops(result.stdout);
  });

  it('exits 1 with a message a person can act on when no service answers', async () => {
    const result = await run('python3', [join(EXAMPLES, 'notebook_client.py'), 'http://127.0.0.1:1'], { LOOPGATE_REPORT_DIR: work });
    expect(result.code).toBe(1);
    expect(result.stderr).toContain('cannot reach loopgate at http://127.0.0.1:1');
  });
});

describe('examples/review.mjs', () => {
  it('prints the service figures, finds in-process analyze() in agreement and saves the reports (or says why not)', async () => {
    const dir = mkdtempSync(join(work, 'mjs-'));
    const result = await run(process.execPath, [join(EXAMPLES, 'review.mjs'), baseUrl], { LOOPGATE_REPORT_DIR: dir, LOOPGATE_URL: '' });
    expect(result.code, result.stderr).toBe(0);
    await expectPrintedLoops(result.stdout);
    expect(result.stdout).toContain('in-process analyze(): the same figures and request hashes as the service');
    expectReports(result.stdout, dir);
  });

  it('with --in-process needs no server and prints the same figures', async () => {
    const result = await run(process.execPath, [join(EXAMPLES, 'review.mjs'), '--in-process'], { LOOPGATE_URL: 'http://127.0.0.1:1', LOOPGATE_REPORT_DIR: work });
    expect(result.code, result.stderr).toBe(0);
    await expectPrintedLoops(result.stdout);
  });

  it.skipIf(!hasPython)('prints the same block per loop as the Python client', async () => {
    const env = { LOOPGATE_URL: baseUrl, LOOPGATE_REPORT_DIR: mkdtempSync(join(work, 'both-')) };
    const [py, js] = await Promise.all([run('python3', [join(EXAMPLES, 'notebook_client.py')], env), run(process.execPath, [join(EXAMPLES, 'review.mjs'), '--in-process'], env)]);
    expect(sections(js.stdout)).toEqual(sections(py.stdout));
  });
});

describe.skipIf(!hasCli)('examples/ci-gate.sh (needs dist/cli/main.js)', { timeout: 120_000 }, () => {
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: (name) => name === 'testcase' || name === 'property' });
  const readJunit = (path: string) => parser.parse(readFileSync(path, 'utf8')).testsuites;

  /** The JUnit file holds one case per loop, failing exactly where POST /v1/checks fails the same batch, under its request hash. */
  async function expectJunitOfService(report: string) {
    const { status, json: checked } = await post('/v1/checks', JSON.parse(readFileSync(BATCH_FILE, 'utf8')));
    expect(status).toBe(200);
    const suites = readJunit(report);
    expect(Number(suites.tests)).toBe(checked.loops.length);
    expect(Number(suites.failures)).toBe(checked.counts.fail);
    expect(checked.counts.fail).toBeGreaterThan(0);
    const cases = suites.testsuite.testcase;
    expect(cases.map((c: { name: string }) => c.name)).toEqual(checked.loops.map((l: { name: string }) => l.name));
    cases.forEach((c: { failure?: unknown }, i: number) => expect(c.failure !== undefined).toBe(checked.loops[i].verdict === 'fail'));
    const hash = suites.testsuite.properties.property.find((p: { name: string }) => p.name === 'loopgate.requestHash');
    expect(hash.value).toBe(checked.requestHash);
  }

  it("against the service (LOOPGATE_URL): exit 1 for the fragile retune, explained, and the service's verdicts in JUnit", async () => {
    const report = join(work, 'gate-server.xml');
    const result = await run('bash', [join(EXAMPLES, 'ci-gate.sh'), BATCH_FILE, report], { LOOPGATE_URL: baseUrl });
    expect(result.code, result.stderr + result.stdout).toBe(1);
    expect(result.stdout).toContain('loopgate: exit 1 - at least one loop fails its criteria');
    await expectJunitOfService(report);
  });

  it('in-process (no LOOPGATE_URL): the same exit code and verdicts', async () => {
    const report = join(work, 'gate-in-process.xml');
    const result = await run('bash', [join(EXAMPLES, 'ci-gate.sh'), BATCH_FILE, report], { LOOPGATE_URL: '' });
    expect(result.code, result.stderr + result.stdout).toBe(1);
    await expectJunitOfService(report);
  });

  it('exit 0 when every loop passes', async () => {
    const batch = JSON.parse(readFileSync(BATCH_FILE, 'utf8'));
    const passing = join(work, 'demo-loops-only.json');
    writeFileSync(passing, JSON.stringify({ ...batch, loops: batch.loops.slice(0, 2) }));
    const result = await run('bash', [join(EXAMPLES, 'ci-gate.sh'), passing, join(work, 'gate-pass.xml')], { LOOPGATE_URL: '' });
    expect(result.code, result.stderr + result.stdout).toBe(0);
    expect(result.stdout).toContain('loopgate: exit 0 - every loop passes');
  });

  it('exit 2 on unusable input, and no report written', async () => {
    const broken = join(work, 'broken.json');
    writeFileSync(broken, JSON.stringify({ loops: [{ name: 'filler-pump-speed', plant: { kind: 'transfer-function', numerator: [1] } }] }));
    const report = join(work, 'gate-broken.xml');
    const result = await run('bash', [join(EXAMPLES, 'ci-gate.sh'), broken, report], { LOOPGATE_URL: '' });
    expect(result.code).toBe(2);
    expect(result.stdout).toContain('loopgate: exit 2 - unusable input');
    expect(existsSync(report)).toBe(false);
  });
});
