/**
 * What the review report shows, computed once: the analysis (with frequency
 * and time responses), the figures as rows against the criteria with a
 * pass / warn / fail mark each, and the overall verdict. The marks come from
 * the review gate's own judgement (judgeLoop), so the report and
 * POST /v1/checks never disagree about a loop.
 */
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import { judgeLoop } from '../gate/judge-loop.js';
import { CRITERION_DESCRIPTIONS, type GateCriterion } from '../gate/criteria-profiles.js';
import { resolveGateCriteria, type ResolvedCriteria } from '../gate/resolve-gate-criteria.js';
import { formatFixed, formatNumber } from '../render/format-number.js';
import { analyzeRequest } from './analyze.js';
import { buildLoop } from './build-loop.js';
import { checkAnalysisRequest } from './check-analysis-request.js';
import { LoopgateError } from './errors.js';
import { TIME_RESPONSE_UNAVAILABLE } from './time-response-answer.js';
import { parseBody } from './parse-body.js';
import { requestHash } from './request-hash.js';
import { isDiscretePlant } from './sampled-request.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';
import type { AnalysisResponse } from './schemas/analysis-response.js';
import type { Finding, Verdict } from './schemas/checks.js';
import { ReportRequestSchema } from './schemas/report-request.js';

export type Mark = Verdict | 'none';

export interface FigureRow {
  /** Stable key, also the row's data-figure attribute. */
  key: string;
  name: string;
  /** The API's number for this figure (null when it does not exist). */
  value: number | null;
  text: string;
  limit: string;
  mark: Mark;
  source: string;
}

export interface ReportModel {
  title: string;
  request: AnalysisRequest;
  analysis: AnalysisResponse;
  profile: string;
  verdict: Verdict;
  findings: Finding[];
  criteriaRows: FigureRow[];
  otherRows: FigureRow[];
  timeRows: FigureRow[];
  /** Why there is no time response (null when there is one). */
  timeResponseUnavailable: string | null;
}

const STABILITY_SOURCE = 'Åström & Murray, Feedback Systems, 2nd ed., §10.2 (Nyquist criterion)';

/** Parses a report body and computes everything the page shows. */
export function reportModel(body: unknown): ReportModel {
  const parsed = parseBody(ReportRequestSchema, body);
  const { report, ...request } = parsed;
  // The hash of the analysis part as sent, so that it equals what POST /v1/analyses answers for it.
  const sent = body !== null && typeof body === 'object' ? { ...(body as Record<string, unknown>) } : {};
  delete sent.report;
  checkAnalysisRequest(request);
  // A plant given in z has only the sampled-loop review: no continuous loop to build or simulate.
  const discrete = isDiscretePlant(request.plant);
  const built = discrete ? null : buildLoop(request);
  const wantsTime = discrete ? undefined : request.timeResponse ?? (built!.plant.rational ? {} : undefined);
  const hash = requestHash(sent);
  let analysis: AnalysisResponse;
  let timeResponseUnavailable: string | null = null;
  try {
    analysis = analyzeRequest({ ...request, detail: 'full', timeResponse: wantsTime }, hash);
  } catch (err) {
    // A simulation the caller did not ask for must not cost them the frequency-domain report.
    if (request.timeResponse || !(err instanceof LoopgateError) || err.code !== 'time_response_not_simulable') throw err;
    analysis = analyzeRequest({ ...request, detail: 'full' }, hash);
    timeResponseUnavailable = err.message;
  }
  if (discrete) timeResponseUnavailable = 'a plant given in z is reviewed as a sampled loop only; time responses are simulated for continuous rational plants.';
  timeResponseUnavailable ??= analysis.timeResponse ? null : analysis.warnings.find((w) => w.code === TIME_RESPONSE_UNAVAILABLE)?.message ?? 'No time response was computed for this loop.';
  const criteria = resolveGateCriteria({ profile: report?.profile, ...(request.criteria ?? {}) });
  const loopDelay = built?.loop.rational ? built.loop.delay : null;
  const judged = judgeLoop(analysis as LoopAnalysis, criteria, loopDelay);
  return {
    title: report?.title ?? 'Loop review',
    request,
    analysis,
    profile: criteria.profile,
    verdict: judged.verdict,
    findings: judged.findings,
    criteriaRows: criteriaRows(analysis, criteria, judged.findings, loopDelay),
    otherRows: otherRows(analysis),
    timeRows: timeRows(analysis),
    timeResponseUnavailable,
  };
}

function markFor(key: GateCriterion, criteria: ResolvedCriteria, findings: readonly Finding[]): Mark {
  if (criteria.limits[key].value === null) return 'none';
  const f = findings.filter((x) => x.criterion === key);
  if (f.some((x) => x.severity === 'fail')) return 'fail';
  return f.length ? 'warn' : 'pass';
}

function limitText(key: GateCriterion, criteria: ResolvedCriteria): string {
  const l = criteria.limits[key];
  if (l.value === null) return 'not checked';
  const unit = CRITERION_DESCRIPTIONS[key].unit;
  const v = formatNumber(l.value, 4);
  const text: Record<GateCriterion, string> = {
    minGainMarginDb: `|GM| ≥ ${v} dB`,
    minPhaseMarginDegrees: `PM ≥ ${v}°`,
    maxSensitivityPeak: `Ms ≤ ${v}`,
    maxComplementaryPeak: `Mt ≤ ${v}`,
    minDelayMarginSeconds: `≥ ${v} s`,
    minDelayMarginMultiple: `≥ ${v} × the loop delay`,
  };
  return `${text[key] ?? `${v} ${unit}`}${l.severity === 'warn' ? ' (warns only)' : ''}`;
}

function criteriaRows(a: AnalysisResponse, criteria: ResolvedCriteria, findings: readonly Finding[], loopDelay: number | null): FigureRow[] {
  const m = a.margins;
  const row = (key: GateCriterion, name: string, value: number | null, text: string): FigureRow => ({
    key,
    name,
    value,
    text,
    limit: limitText(key, criteria),
    mark: markFor(key, criteria, findings),
    source: criteria.limits[key].source,
  });
  const unstable = !a.stability.closedLoopStable;
  const rows: FigureRow[] = [
    {
      key: 'closedLoopStable',
      name: 'Closed-loop stability',
      value: a.stability.closedLoopStable ? 1 : 0,
      text: unstable
        ? `unstable: ${a.stability.nyquist.closedLoopUnstablePoles} closed-loop pole(s) in the right half-plane`
        : `stable (N = ${a.stability.nyquist.clockwiseEncirclements}, P = ${a.stability.openLoopUnstablePoles}, Z = N + P = 0)`,
      limit: 'stable under every profile',
      mark: unstable ? 'fail' : 'pass',
      source: STABILITY_SOURCE,
    },
    row('minGainMarginDb', 'Gain margin', m.gain ? m.gain.db : null,
      m.gain ? `${formatFixed(m.gain.db, 2)} dB (×${formatNumber(m.gain.ratio, 4)}) at ${formatNumber(m.gain.frequency, 4)} rad/s` : '∞: no phase crossover'),
    row('minPhaseMarginDegrees', 'Phase margin', m.phase ? m.phase.degrees : null,
      m.phase ? `${formatFixed(m.phase.degrees, 2)}° at ${formatNumber(m.phase.frequency, 4)} rad/s` : 'none: |L| does not cross 1'),
    row('maxSensitivityPeak', 'Sensitivity peak Ms', a.peaks.sensitivity.value,
      `${formatFixed(a.peaks.sensitivity.value, 3)} (${formatFixed(a.peaks.sensitivity.db, 2)} dB)${peakWhere(a.peaks.sensitivity.frequency)}`),
    row('maxComplementaryPeak', 'Complementary sensitivity peak Mt', a.peaks.complementarySensitivity.value,
      `${formatFixed(a.peaks.complementarySensitivity.value, 3)} (${formatFixed(a.peaks.complementarySensitivity.db, 2)} dB)${peakWhere(a.peaks.complementarySensitivity.frequency)}`),
    row('minDelayMarginSeconds', 'Delay margin', m.delay ? m.delay.seconds : null,
      m.delay ? `${formatNumber(m.delay.seconds, 4)} s at ${formatNumber(m.delay.frequency, 4)} rad/s` : 'none'),
  ];
  if (criteria.limits.minDelayMarginMultiple.value !== null) {
    const multiple = m.delay && loopDelay ? m.delay.seconds / loopDelay : null;
    rows.push(row('minDelayMarginMultiple', 'Delay margin / loop delay', multiple,
      multiple === null ? (loopDelay === null ? 'loop delay not stated by this plant kind' : 'n/a') : `${formatNumber(multiple, 4)} × ${formatNumber(loopDelay!, 4)} s`));
  }
  return rows;
}

const peakWhere = (w: number | null) => (w === null ? ' as ω → ∞' : w === 0 ? ' at ω = 0' : ` at ${formatNumber(w, 4)} rad/s`);

function info(key: string, name: string, value: number | null, text: string): FigureRow {
  return { key, name, value, text, limit: '', mark: 'none', source: '' };
}

function otherRows(a: AnalysisResponse): FigureRow[] {
  const b = a.bandwidth;
  const rad = (v: number | null) => (v === null ? 'none' : `${formatNumber(v, 4)} rad/s`);
  return [
    info('crossoverFrequency', 'Gain crossover frequency ωc', b.crossover, rad(b.crossover)),
    info('closedLoopBandwidth', 'Closed-loop bandwidth (|T| = −3 dB)', b.closedLoop, rad(b.closedLoop)),
    info('sensitivityBandwidth', 'Sensitivity bandwidth (|S| = −3 dB)', b.sensitivity, rad(b.sensitivity)),
  ];
}

function timeRows(a: AnalysisResponse): FigureRow[] {
  const t = a.timeResponse;
  if (!t) return [];
  const s = t.setpoint;
  const d = t.loadDisturbance;
  const sec = (v: number | null) => (v === null ? 'n/a' : `${formatNumber(v, 4)} s`);
  return [
    info('overshootPercent', 'Setpoint step: overshoot', s.overshootPercent, s.overshootPercent === null ? 'n/a' : `${formatFixed(s.overshootPercent, 2)} %`),
    info('peakTime', 'Setpoint step: peak time', s.peakTime, sec(s.peakTime)),
    info('riseTime', 'Setpoint step: rise time (10–90 %)', s.riseTime, sec(s.riseTime)),
    info('settlingTime', 'Setpoint step: settling time (2 %)', s.settlingTime, sec(s.settlingTime)),
    info('steadyStateError', 'Setpoint step: steady-state error', s.steadyStateError, s.steadyStateError === null ? 'n/a' : formatNumber(Math.abs(s.steadyStateError) < 1e-12 ? 0 : s.steadyStateError, 4)),
    info('peakDeviation', 'Load step: peak deviation', d.peakDeviation, d.peakDeviation === null ? 'n/a' : `${formatNumber(d.peakDeviation, 4)} at ${sec(d.peakDeviationTime)}`),
    info('iae', 'Load step: IAE', d.iae, d.iae === null ? 'n/a' : `${formatNumber(d.iae, 4)} (over ${formatNumber(t.duration, 4)} s)`),
  ];
}
