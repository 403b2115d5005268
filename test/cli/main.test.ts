/**
 * The command line through a real child process (`node bin/loopgate.js`,
 * which runs the BUILT dist/cli/main.js: `npm test` builds first).
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../src/http/app.js';
import { runChecks } from '../../src/gate/run-checks.js';
import { thirdOrderGainFor, thirdOrderLag } from '../gate/support/closed-form-loops.js';

const BIN = fileURLToPath(new URL('../../bin/loopgate.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'loopgate-cli-'));

function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [BIN, ...args], { timeout: 60_000 }, (err, stdout, stderr) => {
      const code = err ? ((err as { code?: number }).code ?? -1) : 0;
      resolve({ code: typeof code === 'number' ? code : -1, stdout, stderr });
    });
  });
}

// GM = 6/K (Ogata): 0.5 → 21.6 dB passes; 5 dB fails the baseline's 6 dB.
const passing = { loops: [{ name: 'filler-pump speed', plant: thirdOrderLag(0.5) }] };
const failing = { loops: [...passing.loops, { name: 'pasteuriser temperature', plant: thirdOrderLag(thirdOrderGainFor(5)) }] };
const warning = { loops: [{ name: 'filler-pump speed', plant: thirdOrderLag(0.5), criteria: { maxComplementaryPeak: 0.9 } }] }; // Mt = 1: warns

let app: FastifyInstance;
let server: string;
beforeAll(async () => {
  app = await buildApp();
  server = await app.listen({ host: '127.0.0.1', port: 0 });
});
afterAll(async () => {
  await app.close();
});

describe('loopgate check: exit codes', () => {
  it('0 when every loop passes, with the table on stdout and nothing on stderr when not a terminal', async () => {
    const r = await run(['check', file('pass.json', passing)]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^LOOP\s+VERDICT/);
    expect(r.stdout).toContain('PASS: 1 loop(s)');
    expect(r.stderr).toBe('');
  });

  it('1 when a loop fails', async () => {
    const r = await run(['check', file('fail.json', failing)]);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('[fail] gain_margin_low');
  });

  it('0 when loops only warn, 1 with --fail-on-warn', async () => {
    const path = file('warn.json', warning);
    const [plain, strict] = await Promise.all([run(['check', path]), run(['check', path, '--fail-on-warn'])]);
    expect(plain.code).toBe(0);
    expect(strict.code).toBe(1);
  });

  it('--profile replaces the file profile: advisory turns the failure into a warning', async () => {
    const r = await run(['check', file('fail2.json', { criteria: { profile: 'baseline' }, ...failing }), '--profile', 'advisory', '--format', 'json']);
    expect(r.code).toBe(0);
    const answer = JSON.parse(r.stdout);
    expect(answer.profile).toBe('advisory');
    expect(answer.verdict).toBe('warn');
  });

  it('2 on unusable input, with a message naming the file and the field', async () => {
    const p = file('p.json', passing);
    const [missing, notJson, shape, model, ...usage] = await Promise.all([
      run(['check', join(dir, 'nope.json')]),
      run(['check', file('bad.json', '{"loops": [')]),
      run(['check', file('shape.json', { loops: [{ name: 'x', plant: { kind: 'transfer-function', numerator: 'one', denominator: [1] } }] })]),
      run(['check', file('model.json', { loops: [...passing.loops, { name: 'y', plant: { kind: 'transfer-function', numerator: [1], denominator: [0, 0] } }] })]),
      run(['check', p, '--profile', 'lenient']),
      run(['check', p, '--format', 'pdf']),
      run(['check']),
      run(['check', p, '--colour']),
      run(['check', p, '--server', 'not a url']),
    ]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('nope.json: cannot read the file');
    expect(notJson.code).toBe(2);
    expect(notJson.stderr).toMatch(/bad\.json: not valid JSON/);
    expect(shape.code).toBe(2);
    expect(shape.stderr).toContain('shape.json: loops[0].plant.numerator:');
    expect(model.code).toBe(2);
    expect(model.stderr).toContain('model.json: loops[1].plant.denominator:');
    expect(model.stderr).toContain('[zero_denominator]');
    for (const u of usage) {
      expect(u.code).toBe(2);
      expect(u.stderr).toMatch(/^loopgate: .*see loopgate --help/);
    }
  });
});

describe('loopgate check: reports', () => {
  it('--format junit --output writes JUnit XML (one testcase per loop) and still prints the table', async () => {
    const out = join(dir, 'report.xml');
    const r = await run(['check', file('loops.json', failing), '--format', 'junit', '--output', out]);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('pasteuriser temperature');
    const xml = readFileSync(out, 'utf8');
    expect(XMLValidator.validate(xml)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', isArray: (n) => n === 'testcase' }).parse(xml);
    const cases = doc.testsuites.testsuite.testcase;
    expect(doc.testsuites.testsuite['@name']).toBe('loops.json');
    expect(cases.map((c: Record<string, string>) => c['@name'])).toEqual(['filler-pump speed', 'pasteuriser temperature']);
    expect(cases[0].failure).toBeUndefined();
    expect(cases[1].failure['#text']).toContain('gain_margin_low');
  });

  it('--format json prints the service answer, the same as the in-process check', async () => {
    const r = await run(['check', file('json.json', failing), '--format', 'json']);
    expect(JSON.parse(r.stdout)).toEqual(await runChecks(failing));
  });
});

describe('loopgate check --server', () => {
  it('asks a running service and answers the same', async () => {
    const path = file('remote.json', failing);
    const remote = await run(['check', path, '--server', server, '--format', 'json']);
    expect(remote.code).toBe(1);
    expect(JSON.parse(remote.stdout)).toEqual(await runChecks(failing));
  });

  it('2 when the service refuses the input (naming file and field), 3 when it cannot be reached', async () => {
    const refused = await run(['check', file('r.json', { loops: [{ name: 'y', plant: { kind: 'transfer-function', numerator: [1], denominator: [0] } }] }), '--server', server]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('r.json: loops[0].plant.denominator:');
    // Port 9 (discard) on loopback: nothing listens there in this test.
    const unreachable = await run(['check', file('u.json', passing), '--server', 'http://127.0.0.1:9']);
    expect(unreachable.code).toBe(3);
    expect(unreachable.stderr).toContain('cannot reach the loopgate service');
  });
});

describe('loopgate --help, --version', () => {
  it('print and exit 0', async () => {
    const [help, version] = await Promise.all([run(['--help']), run(['--version'])]);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain('usage: loopgate check FILE.json');
    expect(version.stdout).toMatch(/^loopgate \d+\.\d+\.\d+/);
  });
});
