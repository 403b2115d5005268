/**
 * The Bode figure: magnitude (dB) and phase (degrees) of L against
 * log-frequency (rad/s), with |S| and |T| optionally on the magnitude
 * panel. Gain crossovers, phase crossovers, the margins and the sensitivity
 * peaks are marked on the curves and labelled with their values, taken from
 * the analysis (never re-derived from the plotted samples).
 */
import type { AnalysisResponse } from '../contract/schemas/analysis-response.js';
import { drawAxes } from './axes/draw-axes.js';
import { drawLegend, type LegendEntry } from './axes/legend.js';
import { linearTicks } from './axes/linear-ticks.js';
import { logTicks } from './axes/log-ticks.js';
import { clipPathFor, panelBottom, panelRight, type Panel } from './axes/panel.js';
import { panelDataAttributes } from './axes/panel-data.js';
import { linearScale, logScale, type Scale } from './axes/scale.js';
import { formatFixed, formatNumber } from './format-number.js';
import { interpolateLogFrequency } from './interpolate-log-frequency.js';
import { LabelPlacer, type Bounds } from './marks.js';
import { element, textElement } from './svg/element.js';
import { clipPolyline, type Rect } from './svg/clip-polyline.js';
import { runsPath } from './svg/path-data.js';
import { svgDocument } from './svg/svg-document.js';

export type BodeInput = Pick<AnalysisResponse, 'margins' | 'peaks' | 'response'>;

export interface BodeFigureOptions {
  /** Draw |S| and |T| on the magnitude panel (default true). */
  closedLoop?: boolean;
  idPrefix?: string;
  title?: string;
}

const WIDTH = 760;
const HEIGHT = 610;
const MAGNITUDE: Panel = { left: 84, top: 66, width: 640, height: 230 };
const PHASE: Panel = { left: 84, top: 326, width: 640, height: 220 };
/** Magnitudes more than this far below the highest plotted one are clipped (a roll-off to −300 dB says nothing). */
const MAGNITUDE_DEPTH_DB = 140;

export function renderBodePlot(analysis: BodeInput, options: BodeFigureOptions = {}): string {
  const r = analysis.response;
  if (!r || r.frequency.length < 2) throw new Error('renderBodePlot needs the frequency response (detail "full")');
  const id = options.idPrefix ?? 'bode-';
  const closedLoop = options.closedLoop ?? true;
  const f = r.frequency;
  const x = logScale([f[0], f[f.length - 1]], [MAGNITUDE.left, panelRight(MAGNITUDE)]);
  const xt = logTicks(f[0], f[f.length - 1]);
  const xLabel = (v: number) => formatNumber(v);

  // Magnitude axis: everything shown, with 0 dB always in view.
  const shown = [r.loop.magnitudeDb, ...(closedLoop ? [r.sensitivity.magnitudeDb, r.complementarySensitivity.magnitudeDb] : [])];
  const finite = shown.flat().filter(Number.isFinite);
  const top = Math.max(0, ...finite);
  const bottom = Math.max(Math.min(0, ...finite), top - MAGNITUDE_DEPTH_DB);
  const mt = linearTicks(bottom, top, 6, [1, 2, 5, 10, 20, 40, 60, 100]);
  const yMag = linearScale([mt.lo, mt.hi], [panelBottom(MAGNITUDE), MAGNITUDE.top]);

  // Phase axis: down to half a turn below the deepest −180° line that matters, so a fast-turning delay does not flatten the rest.
  const phase = r.loop.phaseDeg;
  const levels = [analysis.margins.gain?.frequency, ...analysis.margins.gainCrossovers.map((c) => c.frequency)]
    .filter((w): w is number => w !== undefined)
    .map((w) => nearestOddHalfTurn(interpolateLogFrequency(f, phase, w)))
    .filter(Number.isFinite);
  const lowestLevel = Math.min(-180, ...levels);
  const highestLevel = Math.max(-180, ...levels);
  const pMax = Math.max(...phase.filter(Number.isFinite));
  const pMin = Math.max(Math.min(...phase.filter(Number.isFinite)), lowestLevel - 90);
  const pt = linearTicks(Math.min(pMin, highestLevel), Math.max(pMax, lowestLevel + 45), 5, [15, 30, 45, 90, 180, 360, 720]);
  const yPh = linearScale([pt.lo, pt.hi], [panelBottom(PHASE), PHASE.top]);
  const phaseClipped = Math.min(...phase.filter(Number.isFinite)) < pt.lo;

  const body: string[] = [
    element('defs', {}, [clipPathFor(`${id}clip-mag`, MAGNITUDE), clipPathFor(`${id}clip-phase`, PHASE)]),
    textElement(options.title ?? 'Bode diagram of the loop L = C·P', { class: 'plot-title', x: MAGNITUDE.left, y: 24 }),
  ];
  const legend: LegendEntry[] = [{ series: 'loop', label: '|L|, ∠L' }];
  if (closedLoop) legend.push({ series: 'sensitivity', label: '|S| = |1/(1+L)|' }, { series: 'complementarySensitivity', label: '|T| = |L/(1+L)|' });
  body.push(drawLegend(legend, MAGNITUDE.left, 48));

  body.push(
    drawAxes(
      MAGNITUDE,
      { scale: x, major: xt.major, minor: xt.minor, label: () => '' },
      { scale: yMag, major: mt.values, label: (v) => formatNumber(v), title: 'magnitude (dB)' },
      'magnitude',
    ),
    drawAxes(
      PHASE,
      { scale: x, major: xt.major, minor: xt.minor, label: xLabel, title: 'frequency ω (rad/s)' },
      { scale: yPh, major: pt.values, label: (v) => formatNumber(v), title: 'phase (°)' },
      'phase',
    ),
  );

  // Reference lines: 0 dB, and −180° − k·360° within the phase range.
  const refs: string[] = [element('line', { class: 'reference', x1: MAGNITUDE.left, x2: panelRight(MAGNITUDE), y1: yMag(0), y2: yMag(0) })];
  for (let level = -180; level >= pt.lo; level -= 360) {
    if (level <= pt.hi) refs.push(element('line', { class: 'reference', x1: PHASE.left, x2: panelRight(PHASE), y1: yPh(level), y2: yPh(level) }));
  }
  for (let level = 180; level <= pt.hi; level += 360) {
    if (level >= pt.lo) refs.push(element('line', { class: 'reference', x1: PHASE.left, x2: panelRight(PHASE), y1: yPh(level), y2: yPh(level) }));
  }
  body.push(element('g', { class: 'references' }, refs));

  const curve = (series: string, name: string, values: readonly number[], y: Scale, clip: string) =>
    element('path', {
      class: `curve series-${series}`,
      'data-series': name,
      'clip-path': `url(#${clip})`,
      d: runsPath(clipPolyline(f.map((w, i) => ({ x: x(w), y: y(values[i]) })), rectOf(y))),
    });
  const magCurves = [curve('loop', 'loop-magnitude', r.loop.magnitudeDb, yMag, `${id}clip-mag`)];
  if (closedLoop) {
    magCurves.push(
      curve('sensitivity', 'sensitivity-magnitude', r.sensitivity.magnitudeDb, yMag, `${id}clip-mag`),
      curve('complementarySensitivity', 'complementary-magnitude', r.complementarySensitivity.magnitudeDb, yMag, `${id}clip-mag`),
    );
  }
  body.push(element('g', panelDataAttributes('magnitude', MAGNITUDE, x, yMag), magCurves));
  body.push(element('g', panelDataAttributes('phase', PHASE, x, yPh), [curve('loop', 'loop-phase', phase, yPh, `${id}clip-phase`)]));

  const placer = new LabelPlacer();
  const ctx: MarkContext = { f, phase, x, yMag, yPh, placer, magBounds: boundsOf(MAGNITUDE), phaseBounds: boundsOf(PHASE) };
  body.push(element('g', { class: 'marks' }, [
    ...gainCrossoverMarks(analysis, ctx),
    ...phaseCrossoverMarks(analysis, r.loop.magnitudeDb, ctx),
    ...(closedLoop ? peakMarks(analysis, ctx) : []),
  ]));
  if (phaseClipped) {
    body.push(textElement(`phase below ${formatNumber(pt.lo)}° not shown`, { class: 'note', x: panelRight(PHASE), y: panelBottom(PHASE) + 44, 'text-anchor': 'end' }));
  }
  return svgDocument(
    {
      width: WIDTH,
      height: HEIGHT,
      idPrefix: id,
      kind: 'bode',
      title: 'Bode diagram',
      description: describeMargins(analysis),
    },
    body,
  );
}

/** −180° − k·360° nearest to a phase value. */
function nearestOddHalfTurn(phase: number): number {
  return -180 + 360 * Math.round((phase + 180) / 360);
}

/** The screen rectangle of a panel from its scales. */
function rectOf(y: Scale): Rect {
  return { x0: MAGNITUDE.left, x1: panelRight(MAGNITUDE), y0: Math.min(...y.range), y1: Math.max(...y.range) };
}

/** Keeps far-off-scale points a little outside the panel so the clip path, not the renderer, cuts them. */
function clampScreen(v: number, y: Scale): number {
  if (!Number.isFinite(v)) return v;
  const [a, b] = [Math.min(...y.range), Math.max(...y.range)];
  const pad = (b - a) * 0.5;
  return Math.min(b + pad, Math.max(a - pad, v));
}

interface MarkContext {
  f: readonly number[];
  phase: readonly number[];
  x: Scale;
  yMag: Scale;
  yPh: Scale;
  placer: LabelPlacer;
  magBounds: Bounds;
  phaseBounds: Bounds;
}

const boundsOf = (p: Panel): Bounds => ({ left: p.left, right: panelRight(p), top: p.top, bottom: panelBottom(p) });

/** Phase crossovers beyond the nearest few are drawn but not labelled (a delay makes infinitely many). */
const LABELLED_PHASE_CROSSOVERS = 2;

function gainCrossoverMarks(a: BodeInput, c: MarkContext): string[] {
  const out: string[] = [];
  const primary = a.margins.phase?.frequency;
  // The primary crossover first, so its label gets the best place.
  const crossovers = [...a.margins.gainCrossovers].sort((p, q) => Number(q.frequency === primary) - Number(p.frequency === primary));
  for (const g of crossovers) {
    const sx = c.x(g.frequency);
    if (!Number.isFinite(sx)) continue;
    const ph = interpolateLogFrequency(c.f, c.phase, g.frequency);
    const ref = ph - g.phaseMarginDegrees;
    const isPrimary = g.frequency === primary;
    out.push(
      element('line', { class: 'mark', 'data-mark': 'gain-crossover', x1: sx, x2: sx, y1: c.yMag.range[1], y2: c.yPh.range[0], 'stroke-dasharray': '2 3', 'stroke-width': 0.8 }),
      element('circle', { class: 'mark-dot', cx: sx, cy: c.yMag(0), r: 3.5 }),
    );
    if (!Number.isFinite(ph)) continue;
    out.push(
      element('line', { class: 'mark', 'data-mark': 'phase-margin', x1: sx, x2: sx, y1: clampScreen(c.yPh(ref), c.yPh), y2: c.yPh(ph), 'stroke-width': 2.2 }),
      element('circle', { class: 'mark-dot', cx: sx, cy: c.yPh(ph), r: 3.5 }),
    );
    const delay = g.delayMarginSeconds === null ? '' : `, delay margin ${formatNumber(g.delayMarginSeconds)} s`;
    const text = isPrimary
      ? `PM ${formatFixed(g.phaseMarginDegrees, 1)}° at ωc = ${formatNumber(g.frequency)} rad/s${delay}`
      : `PM ${formatFixed(g.phaseMarginDegrees, 1)}°`;
    out.push(c.placer.place(text, sx, clampScreen(c.yPh((ref + ph) / 2), c.yPh), c.phaseBounds, isPrimary ? 'phase-margin' : 'phase-margin-other', isPrimary));
  }
  return out;
}

function phaseCrossoverMarks(a: BodeInput, mag: readonly number[], c: MarkContext): string[] {
  const out: string[] = [];
  const primary = a.margins.gain?.frequency;
  // phaseCrossovers come nearest to instability first.
  a.margins.phaseCrossovers.forEach((p, rank) => {
    const sx = c.x(p.frequency);
    if (!Number.isFinite(sx)) return;
    const m = interpolateLogFrequency(c.f, mag, p.frequency);
    const ph = interpolateLogFrequency(c.f, c.phase, p.frequency);
    const isPrimary = p.frequency === primary;
    if (Number.isFinite(ph) && ph >= c.yPh.domain[0]) out.push(element('circle', { class: 'mark-dot', cx: sx, cy: c.yPh(ph), r: 3.5 }));
    if (!Number.isFinite(m) || rank >= LABELLED_PHASE_CROSSOVERS) return;
    out.push(
      element('line', { class: 'mark', 'data-mark': 'phase-crossover', x1: sx, x2: sx, y1: c.yMag.range[1], y2: c.yPh.range[0], 'stroke-dasharray': '1 3', 'stroke-width': 0.8 }),
      element('line', { class: 'mark', 'data-mark': 'gain-margin', x1: sx, x2: sx, y1: clampScreen(c.yMag(0), c.yMag), y2: clampScreen(c.yMag(m), c.yMag), 'stroke-width': 2.2 }),
      element('circle', { class: 'mark-dot', cx: sx, cy: clampScreen(c.yMag(m), c.yMag), r: 3.5 }),
    );
    // p.db = −|L| in dB and p.ratio = 1/|L| there: the margin itself.
    const text = isPrimary ? `GM ${formatFixed(p.db, 1)} dB (×${formatNumber(p.ratio)}) at ω180 = ${formatNumber(p.frequency)} rad/s` : `GM ${formatFixed(p.db, 1)} dB`;
    out.push(c.placer.place(text, sx, clampScreen(c.yMag(m / 2), c.yMag), c.magBounds, isPrimary ? 'gain-margin' : 'gain-margin-other', isPrimary));
  });
  return out;
}

function peakMarks(a: BodeInput, c: MarkContext): string[] {
  const out: string[] = [];
  const peaks = [
    { peak: a.peaks.sensitivity, name: 'Ms', mark: 'sensitivity-peak' },
    { peak: a.peaks.complementarySensitivity, name: 'Mt', mark: 'complementary-peak' },
  ];
  for (const { peak, name, mark } of peaks) {
    const text = `${name} ${formatNumber(peak.value)} (${formatFixed(peak.db, 1)} dB)`;
    const sx = peak.frequency === null || peak.frequency <= 0 ? NaN : c.x(peak.frequency);
    if (!Number.isFinite(sx)) {
      const where = peak.frequency === null ? 'as ω → ∞' : 'outside the plotted band';
      out.push(c.placer.place(`${text} ${where}`, c.magBounds.right - 260, c.magBounds.top + 8, c.magBounds, mark));
      continue;
    }
    const sy = c.yMag(peak.db);
    out.push(element('circle', { class: 'mark-dot', cx: sx, cy: sy, r: 3.5 }));
    out.push(c.placer.place(text, sx, sy, c.magBounds, mark));
  }
  return out;
}

function describeMargins(a: BodeInput): string {
  const gm = a.margins.gain ? `gain margin ${formatFixed(a.margins.gain.db, 2)} dB at ${formatNumber(a.margins.gain.frequency)} rad/s` : 'no gain margin (no phase crossover)';
  const pm = a.margins.phase ? `phase margin ${formatFixed(a.margins.phase.degrees, 2)}° at ${formatNumber(a.margins.phase.frequency)} rad/s` : 'no phase margin (no gain crossover)';
  return `Magnitude and phase of the loop transfer function against frequency; ${gm}; ${pm}; Ms ${formatNumber(a.peaks.sensitivity.value)}.`;
}
