/**
 * The built server as a child process: configuration errors stop the start,
 * SIGTERM during slow analyses lets every accepted request finish.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, fillerPumpLoop, slowPasteuriserAnalysis } from './http/support/service-config.js';

beforeAll(() => ensureBuilt(), 240_000);

const children: ChildProcess[] = [];
afterEach(() => {
  for (const c of children.splice(0)) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
});

function start(env: Record<string, string>) {
  const child = spawn(process.execPath, ['dist/server.js'], {
    env: { PATH: process.env.PATH ?? '', HOST: '127.0.0.1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let stdout = '';
  let stderr = '';
  child.stdout!.on('data', (d) => (stdout += String(d)));
  child.stderr!.on('data', (d) => (stderr += String(d)));
  const exited = once(child, 'exit').then(([code]) => code as number | null);
  const listening = new Promise<string>((resolve, reject) => {
    child.stdout!.on('data', () => {
      const m = /Server listening at (http:\/\/127\.0\.0\.1:\d+)/.exec(stdout);
      if (m) resolve(m[1]);
    });
    void exited.then((code) => reject(new Error(`server exited with ${code}: ${stderr}`)));
  });
  listening.catch(() => undefined); // the start-up tests expect the exit; others await listening

  return { child, exited, listening, output: () => ({ stdout, stderr }) };
}

describe('server start', () => {
  it.each([
    [{ PORT: 'eighty' }, 'PORT'],
    [{ LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: '2' }, 'LOOPGATE_MAX_EVENT_LOOP_UTILIZATION'],
    [{ LOOPGATE_API_KEYS: 'too-short' }, 'LOOPGATE_API_KEYS'],
  ])('refuses %o with a clear message and exit code 2', async (env, name) => {
    const s = start(env as Record<string, string>);
    expect(await s.exited).toBe(2);
    const { stderr } = s.output();
    expect(stderr).toContain('loopgate cannot start');
    expect(stderr).toContain(name);
    expect(stderr).not.toContain('too-short');
  });
});

describe('graceful shutdown', () => {
  it('on SIGTERM during slow analyses, answers every accepted request, refuses new connections, exits 0', async () => {
    const s = start({ PORT: '0', LOOPGATE_ANALYSIS_WORKERS: '2', LOOPGATE_SHUTDOWN_GRACE_MS: '60000', LOG_LEVEL: 'info' });
    const base = await s.listening;
    const post = (body: unknown) =>
      fetch(`${base}/v1/analyses`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }).then(async (r) => ({
        status: r.status,
        body: (await r.json()) as { code?: string; grid?: { points: number } },
      }));
    expect((await post(fillerPumpLoop)).status).toBe(200);
    // Four slow analyses on two workers: two compute, two wait in the queue when the signal comes.
    const inFlight = [post(slowPasteuriserAnalysis()), post(slowPasteuriserAnalysis()), post(slowPasteuriserAnalysis()), post(fillerPumpLoop), post(slowPasteuriserAnalysis())];
    await new Promise((r) => setTimeout(r, 400));
    const signalledAt = performance.now();
    s.child.kill('SIGTERM');
    const answers = await Promise.all(inFlight);
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
    for (const a of answers) expect(a.body.grid?.points).toBeGreaterThan(0);
    expect(await s.exited).toBe(0);
    expect(performance.now() - signalledAt).toBeGreaterThan(500); // it did wait for the slow ones
    await expect(fetch(`${base}/healthz`)).rejects.toThrow();
    const { stdout } = s.output();
    expect(stdout).toContain('shutting down: finishing accepted requests');
    expect(stdout).toContain('shut down cleanly');
  }, 120_000);
});
