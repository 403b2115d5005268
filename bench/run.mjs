#!/usr/bin/env node
/**
 * npm run bench — loopgate's benchmark (not part of npm test: speed targets
 * live here, not in unit tests). Prints a table and, with --json FILE, writes
 * every figure measured.
 *
 *   node bench/run.mjs [--seconds S] [--rounds R] [--http-rounds H] [--only core|http] [--json FILE]
 *
 * Core: median CPU time per analyze(body) / estimate(body) against a
 * vectorised numpy peer (bench/numpy_peer.py) run in the same benchmark.
 * HTTP: autocannon on 127.0.0.1, 16 connections (bench/http.mjs).
 */
import { writeFileSync } from 'node:fs';
import { availableParallelism, cpus, loadavg } from 'node:os';
import { runCore } from './core.mjs';
import { runHttp } from './http.mjs';
import { median, quartiles } from './timing.mjs';

const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : fallback;
};
const seconds = Number(option('seconds', 1));
const rounds = Number(option('rounds', 3));
// HTTP loads are interleaved in short slices: this machine's speed drifts by tens of per cent
// over seconds, and a ratio of two rates measured a few seconds apart inherits that drift.
const httpRounds = Number(option('http-rounds', 15));
const only = option('only', 'all');
const jsonFile = option('json', null);

const fmt = (x, digits = 1) => (x === null || x === undefined || Number.isNaN(x) ? '–' : x.toFixed(digits));
const us = (x) => (x >= 10_000 ? `${fmt(x / 1000, 1)} ms` : `${fmt(x, 1)} µs`);
const verdict = (value, target, atMost) => (target === null ? '' : (atMost ? value <= target : value >= target) ? 'met' : 'NOT met');

const environment = {
  date: new Date().toISOString(),
  node: process.version,
  cpus: `${availableParallelism()} × ${cpus()[0]?.model ?? 'unknown'}`,
  loadAverageAtStart: loadavg().map((x) => x.toFixed(2)).join(' '),
};
const out = { environment };
const lines = [];
const say = (s = '') => {
  lines.push(s);
  console.log(s);
};

say(`loopgate benchmark — ${environment.date}, node ${environment.node}, ${environment.cpus}, load average ${environment.loadAverageAtStart}`);
say(`command: npm run bench${args.length ? ` -- ${args.join(' ')}` : ''}`);

if (only === 'all' || only === 'core') {
  const core = await runCore({ seconds: seconds * 2 });
  out.core = core;
  const peer = core.peer;
  const peerFailure = peer.error ?? peer.timingError;
  say('');
  say(`Core (median CPU time per call; numpy ${peer.numpy ?? '?'} on python ${peer.python ?? '?'}${peerFailure ? `; peer failed: ${peerFailure}` : ''}; ${core.rounds} rounds, loopgate and numpy taking turns on each case; a ratio is taken within each round, its median and interquartile range are shown)`);
  say('');
  say('| case | detail | loopgate | numpy | loopgate/numpy | target |');
  say('|---|---|---:|---:|---:|---|');
  for (const a of core.analyses) {
    for (const detail of ['summary', 'full']) {
      const t = a[detail];
      const ratio = t.ratios.length ? median(t.ratios) : NaN;
      const [q1, q3] = t.ratios.length ? quartiles(t.ratios) : [NaN, NaN];
      const target = a.ratioTarget === null ? '' : `≤ ${a.ratioTarget} (${verdict(ratio, a.ratioTarget, true)})`;
      const shown = Number.isFinite(ratio) ? `${fmt(ratio, 2)} (${fmt(q1, 2)}–${fmt(q3, 2)})` : '–';
      say(`| ${a.title} | ${detail} | ${us(t.microseconds)} | ${t.numpyMicroseconds ? us(t.numpyMicroseconds) : '–'} | ${shown} | ${target} |`);
    }
  }
  const e = core.estimate;
  const pe = peer.estimate;
  say(`| ${e.title} (${e.segments} × ${e.segmentLength}) | – | ${us(e.timing.microseconds)} | ${pe ? us(pe.microseconds) : '–'} | ${pe ? fmt(e.timing.microseconds / pe.microseconds, 2) : '–'} | |`);
  say('');
  say('Refinement check (loopgate figures on the exact model, evaluated by numpy): max |L(jωc)| − 1 and max |sin∠L(jω180)|');
  for (const a of core.analyses) {
    const p = peer.analyses?.find((x) => x.id === a.id);
    const r = p?.loopgateResiduals;
    const pm = p?.figures?.phaseMargin;
    say(`  ${a.id}: ${r ? `${r.gainCrossover?.toExponential(1) ?? '–'}, ${r.phaseCrossover?.toExponential(1) ?? '–'}` : 'measured data (interpolated), not applicable'}; ` +
      `PM loopgate ${fmt(a.figures.phaseMargin, 6)}° vs numpy on the grid ${fmt(pm, 6)}°; Ms ${fmt(a.figures.sensitivityPeak, 6)} vs ${fmt(p?.figures?.sensitivityPeak, 6)}`);
  }
  if (pe) say(`  estimate check at ${fmt(e.check.frequency, 3)} rad/s: |H| ${e.check.magnitude.toExponential(6)} vs numpy ${pe.check.magnitude.toExponential(6)}, γ² ${fmt(e.check.coherence, 6)} vs ${fmt(pe.check.coherence, 6)}`);
}

function httpTable(http, label) {
  say('');
  say(`HTTP, ${label} (autocannon ${http.connections} connections; ${http.rounds} rounds, each of the four loads for ${http.seconds} s in turn; server ${http.address}, logger off, analysis workers ${http.analysisWorkers}; successful answers per second, medians over rounds; a ratio is taken within each round, its median and interquartile range are shown)`);
  say('');
  say('| load | rate | ratio | target |');
  say('|---|---:|---:|---|');
  const failures = (x) => (x.non2xx || x.errors ? ` (${x.non2xx} non-2xx, ${x.errors} errors)` : '');
  say(`| GET /healthz | ${fmt(http.health.perSecond, 0)} req/s${failures(http.health)} | | |`);
  const spread = (key) => {
    const q = quartiles(http.perRound.map((r) => r[key]));
    return `${fmt(q[0], 2)}–${fmt(q[1], 2)}`;
  };
  say(`| POST /v1/analyses, summary | ${fmt(http.summary.perSecond, 0)} /s${failures(http.summary)} | ${fmt(http.summaryOverHealth, 3)} of /healthz (${spread('summaryOverHealth')}) | ≥ 0.4 (${verdict(http.summaryOverHealth, 0.4, false)}) |`);
  say(`| POST /v1/analyses, full (400 points, ${fmt(http.full.bytesPerResponse / 1024, 1)} KiB) | ${fmt(http.full.perSecond, 0)} /s${failures(http.full)} | ${fmt(http.fullOverCanned, 3)} of the ceiling (${spread('fullOverCanned')}) | ≥ 0.8 (${verdict(http.fullOverCanned, 0.8, false)}) |`);
  say(`| ceiling: same server, same body, stored answer of the same size | ${fmt(http.canned.perSecond, 0)} /s${failures(http.canned)} | | |`);
}

if (only === 'all' || only === 'http') {
  const httpSeconds = seconds;
  // As deployed (analyses on worker threads, one per core), then with analyses on the main thread.
  const http = await runHttp({ seconds: httpSeconds, rounds: httpRounds });
  const inline = await runHttp({ seconds: httpSeconds, rounds: httpRounds, env: { LOOPGATE_ANALYSIS_WORKERS: '0', LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: '0', LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: '0' }, batch: false });
  out.http = http;
  out.httpInline = inline;
  httpTable(http, 'default configuration');
  httpTable(inline, 'analyses on the main thread (LOOPGATE_ANALYSIS_WORKERS=0, load shedding off so that saturation is measured, not refused)');
  const c = http.checks;
  say('');
  if (!c.available) say(`Batch: POST /v1/checks — ${c.reason}`);
  else {
    const ip = c.inProcess;
    const speedUp = ip && !ip.error ? ip.singleThreadMs / ip.poolMs : NaN;
    say(`Batch: ${c.loops} loops through POST /v1/checks: ${fmt(c.loopsPerSecond, 0)} loops/s (median ${fmt(c.httpMs, 0)} ms per request)`);
    if (ip?.error) say(`  in-process comparison failed: ${ip.error}`);
    else if (ip) say(`  in-process runChecks: one thread ${fmt(ip.singleThreadMs, 0)} ms (${fmt(1e6 / ip.singleThreadMs, 0)} loops/s), worker pool of ${ip.poolSize} ${fmt(ip.poolMs, 0)} ms (${fmt(1e6 / ip.poolMs, 0)} loops/s): speed-up ${fmt(speedUp, 2)}×`);
  }
}

say('');
say(`load average at end ${loadavg().map((x) => x.toFixed(2)).join(' ')} (figures from a busy machine vary; the ratios are taken within one run)`);
if (jsonFile) writeFileSync(jsonFile, JSON.stringify({ ...out, table: lines }, null, 2));
