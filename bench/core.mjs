/**
 * Core timings: analyze(body) for each analysis case in both details, and
 * estimate(body) on 1,000,000-sample records, against the numpy peer run in
 * the same benchmark (bench/numpy_peer.py, python3 with numpy). The analyses
 * are timed in rounds, loopgate and numpy taking turns case by case, and each
 * ratio is taken within a round (timeInTurns).
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { analyze } from '../dist/contract/analyze.js';
import { estimate } from '../dist/contract/estimate.js';
import { ANALYSIS_CASES, pumpRigRecords } from './cases.mjs';
import { median, medianMicroseconds } from './timing.mjs';

const PEER = fileURLToPath(new URL('./numpy_peer.py', import.meta.url));

/** The figures the peer checks on the exact model and compares with its own. */
function figuresOf(r) {
  return {
    gainCrossovers: r.margins.gainCrossovers.map((g) => g.frequency),
    phaseCrossovers: r.margins.phaseCrossovers.map((p) => p.frequency),
    phaseMargin: r.margins.phase?.degrees ?? null,
    gainMarginDb: r.margins.gain?.db ?? null,
    delayMargin: r.margins.delay?.seconds ?? null,
    sensitivityPeak: r.peaks.sensitivity.value,
    complementaryPeak: r.peaks.complementarySensitivity.value,
    bandwidth: [r.bandwidth.closedLoop, r.bandwidth.sensitivity],
    closedLoopStable: r.stability.closedLoopStable,
    analysisGridPoints: r.grid.points,
  };
}

function runPeer(job) {
  const run = spawnSync('python3', [PEER], { input: JSON.stringify(job), maxBuffer: 64 * 1024 * 1024, encoding: 'utf8' });
  if (run.status !== 0) return { error: (run.stderr || run.error?.message || 'python3 failed').trim().split('\n').slice(-3).join(' ') };
  return JSON.parse(run.stdout);
}

/**
 * The peer as a long-running process that times one case per request
 * (numpy_peer.py --serve), so that loopgate and numpy can take turns: the
 * machine's speed drifts by tens of per cent within seconds, and a ratio of
 * two timings taken half a minute apart inherits that drift.
 */
function startTimingPeer() {
  const child = spawn('python3', [PEER, '--serve'], { stdio: ['pipe', 'pipe', 'pipe'] });
  const waiting = [];
  let failure = null;
  let stderr = '';
  const fail = (why) => {
    failure ??= why;
    for (const w of waiting.splice(0)) w.reject(new Error(failure));
  };
  child.stderr.on('data', (d) => (stderr = (stderr + d).slice(-2000)));
  child.on('error', (err) => fail(err.message));
  child.on('exit', () => fail(stderr.trim().split('\n').slice(-3).join(' ') || 'python3 exited'));
  createInterface({ input: child.stdout }).on('line', (line) => waiting.shift()?.resolve(JSON.parse(line)));
  return {
    time(job) {
      if (failure) return Promise.reject(new Error(failure));
      return new Promise((resolve, reject) => {
        waiting.push({ resolve, reject });
        child.stdin.write(`${JSON.stringify(job)}\n`);
      });
    },
    close: () => child.stdin.end(),
  };
}

/**
 * Every case and detail timed in `rounds` rounds, loopgate then numpy on the
 * same case in each slice of `slice` seconds; the ratio is taken within each
 * round. Returns per case and detail the medians over rounds and the ratios.
 */
async function timeInTurns(rounds, slice) {
  const peer = startTimingPeer();
  const rows = ANALYSIS_CASES.map(() => ({ summary: [], full: [] }));
  let peerError = null;
  try {
    for (let r = 0; r < rounds; r++) {
      for (const [i, c] of ANALYSIS_CASES.entries()) {
        for (const detail of ['summary', 'full']) {
          const body = { ...c.body, detail };
          const own = medianMicroseconds(() => analyze(body), { seconds: slice });
          let numpy = null;
          if (!peerError) {
            try {
              numpy = await peer.time({ body: c.body, detail, seconds: slice });
            } catch (err) {
              peerError = err.message;
            }
          }
          rows[i][detail].push({ own, numpy });
        }
      }
    }
  } finally {
    peer.close();
  }
  const summarise = (list) => {
    const ratios = list.filter((x) => x.numpy).map((x) => x.own.microseconds / x.numpy.microseconds);
    return {
      microseconds: median(list.map((x) => x.own.microseconds)),
      wallMicroseconds: median(list.map((x) => x.own.wallMicroseconds)),
      runs: list.reduce((n, x) => n + x.own.runs, 0),
      numpyMicroseconds: ratios.length ? median(list.filter((x) => x.numpy).map((x) => x.numpy.microseconds)) : null,
      ratios,
    };
  };
  return { rows: rows.map((row) => ({ summary: summarise(row.summary), full: summarise(row.full) })), peerError };
}

export async function runCore({ seconds = 1, samples = 1_000_000, rounds = 7 } = {}) {
  const turns = await timeInTurns(rounds, 0.15 * seconds);
  const analyses = ANALYSIS_CASES.map((c, i) => {
    const out = { id: c.id, title: c.title, ratioTarget: c.ratioTarget, ...turns.rows[i] };
    out.figures = figuresOf(analyze({ ...c.body, detail: 'summary' }));
    out.responseBytes = Buffer.byteLength(JSON.stringify(analyze({ ...c.body, detail: 'full' })));
    return out;
  });

  const records = pumpRigRecords(samples);
  const body = { sampleRate: records.sampleRate, input: Array.from(records.input), output: Array.from(records.output) };
  const first = estimate(body);
  const estimateTiming = medianMicroseconds(() => estimate(body), { seconds: seconds * 3, minBatches: 5 });
  const k = first.frequency.length >> 3;
  const est = {
    id: `estimate-${samples}`,
    title: `estimate from ${samples.toLocaleString('en')}-sample records`,
    segments: first.segments,
    segmentLength: first.segmentLength,
    timing: estimateTiming,
    check: { frequency: first.frequency[k], magnitude: first.magnitude[k], coherence: first.coherence[k] },
  };

  const dir = mkdtempSync(join(tmpdir(), 'loopgate-bench-'));
  let peer;
  try {
    writeFileSync(join(dir, 'u.f64'), Buffer.from(records.input.buffer));
    writeFileSync(join(dir, 'y.f64'), Buffer.from(records.output.buffer));
    peer = runPeer({
      seconds,
      timeAnalyses: false,
      analyses: ANALYSIS_CASES.map((c, i) => ({ id: c.id, body: c.body, loopgate: analyses[i].figures })),
      estimate: { input: join(dir, 'u.f64'), output: join(dir, 'y.f64'), sampleRate: records.sampleRate, segmentLength: first.segmentLength },
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return { analyses, estimate: est, peer: { ...peer, timingError: turns.peerError }, rounds };
}
