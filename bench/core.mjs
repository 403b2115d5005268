/**
 * Core timings: analyze(body) for each analysis case in both details, and
 * estimate(body) on 1,000,000-sample records, against the numpy peer run in
 * the same benchmark (bench/numpy_peer.py, python3 with numpy).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { analyze } from '../dist/contract/analyze.js';
import { estimate } from '../dist/contract/estimate.js';
import { ANALYSIS_CASES, pumpRigRecords } from './cases.mjs';
import { medianMicroseconds } from './timing.mjs';

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

export function runCore({ seconds = 1, samples = 1_000_000 } = {}) {
  const analyses = ANALYSIS_CASES.map((c) => {
    const out = { id: c.id, title: c.title, ratioTarget: c.ratioTarget };
    for (const detail of ['summary', 'full']) {
      const body = { ...c.body, detail };
      out[detail] = medianMicroseconds(() => analyze(body), { seconds });
    }
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
      analyses: ANALYSIS_CASES.map((c, i) => ({ id: c.id, body: c.body, loopgate: analyses[i].figures })),
      estimate: { input: join(dir, 'u.f64'), output: join(dir, 'y.f64'), sampleRate: records.sampleRate, segmentLength: first.segmentLength },
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return { analyses, estimate: est, peer };
}
