/**
 * The Nyquist figure of L(jω): a window zoomed on the critical point −1
 * with the unit circle, the sensitivity circle (radius 1/Ms around −1), the
 * gain- and phase-crossover points and arrows for increasing frequency; and
 * beside it an overview of the whole curve with the radius compressed by
 * r ↦ r/(1 + r), so that infinity is the overview's outer circle and the
 * half-turns at infinite radius that integrators add to the contour can be
 * drawn (dotted). The mirror image for negative frequencies is drawn thin.
 */
import type { AnalysisResponse } from '../contract/schemas/analysis-response.js';
import { drawAxes } from './axes/draw-axes.js';
import { drawLegend } from './axes/legend.js';
import { linearTicks } from './axes/linear-ticks.js';
import { clipPathFor, panelBottom, panelRight, type Panel } from './axes/panel.js';
import { panelDataAttributes } from './axes/panel-data.js';
import { linearScale, type Scale } from './axes/scale.js';
import { arrowHeads } from './arrow-heads.js';
import { formatFixed, formatNumber } from './format-number.js';
import { interpolateLogFrequency } from './interpolate-log-frequency.js';
import { LabelPlacer, type Bounds } from './marks.js';
import { clipPolyline, type Rect } from './svg/clip-polyline.js';
import { element, textElement } from './svg/element.js';
import { runsPath, type Point } from './svg/path-data.js';
import { svgDocument } from './svg/svg-document.js';

export type NyquistInput = Pick<AnalysisResponse, 'margins' | 'peaks' | 'response' | 'stability'>;

export interface NyquistFigureOptions {
  idPrefix?: string;
  title?: string;
}

const WIDTH = 820;
const HEIGHT = 660;
const MAIN: Panel = { left: 76, top: 66, width: 500, height: 500 };
const OVERVIEW: Panel = { left: 622, top: 66, width: 180, height: 180 };
/** Points farther than this from the origin do not widen the zoom window. */
const ZOOM_LIMIT = 6;

interface Window {
  x: [number, number];
  y: [number, number];
}

export function renderNyquistPlot(analysis: NyquistInput, options: NyquistFigureOptions = {}): string {
  const r = analysis.response;
  if (!r || r.frequency.length < 2) throw new Error('renderNyquistPlot needs the frequency response (detail "full")');
  const id = options.idPrefix ?? 'nyquist-';
  const ms = analysis.peaks.sensitivity.value;
  const window = zoomWindow(analysis);
  const xt = linearTicks(window.x[0], window.x[1], 6);
  const yt = linearTicks(window.y[0], window.y[1], 6);
  const sx = linearScale(window.x, [MAIN.left, panelRight(MAIN)]);
  const sy = linearScale(window.y, [panelBottom(MAIN), MAIN.top]);
  const toScreen = (re: number, im: number): Point => ({ x: sx(re), y: sy(im) });
  const rect: Rect = { x0: MAIN.left, y0: MAIN.top, x1: panelRight(MAIN), y1: panelBottom(MAIN) };
  const bounds: Bounds = { left: MAIN.left, right: panelRight(MAIN), top: MAIN.top, bottom: panelBottom(MAIN) };

  const positive = r.loop.real.map((re, i) => toScreen(re, r.loop.imag[i]));
  const mirror = r.loop.real.map((re, i) => toScreen(re, -r.loop.imag[i]));
  const positiveRuns = clipPolyline(positive, rect);

  const body: string[] = [
    element('defs', {}, [clipPathFor(`${id}clip-main`, MAIN), clipPathFor(`${id}clip-overview`, OVERVIEW)]),
    textElement(options.title ?? 'Nyquist diagram of the loop L = C·P', { class: 'plot-title', x: MAIN.left, y: 24 }),
    drawLegend(
      [
        { series: 'loop', label: 'L(jω), ω > 0' },
        { series: 'sensitivityCircle', label: `circle of radius 1/Ms around −1` },
      ],
      MAIN.left,
      48,
    ),
    drawAxes(
      MAIN,
      { scale: sx, major: xt.values, label: (v) => formatNumber(v), title: 'Re L(jω)' },
      { scale: sy, major: yt.values, label: (v) => formatNumber(v), title: 'Im L(jω)' },
      'nyquist',
    ),
  ];

  const unitCircle = circlePoints(0, 0, 1).map((p) => toScreen(p.x, p.y));
  const msCircle = circlePoints(-1, 0, 1 / ms).map((p) => toScreen(p.x, p.y));
  body.push(
    element('g', { 'clip-path': `url(#${id}clip-main)` }, [
      element('line', { class: 'reference', x1: MAIN.left, x2: panelRight(MAIN), y1: sy(0), y2: sy(0), 'stroke-dasharray': '1 3' }),
      element('line', { class: 'reference', y1: MAIN.top, y2: panelBottom(MAIN), x1: sx(0), x2: sx(0), 'stroke-dasharray': '1 3' }),
      element('path', { class: 'reference', 'data-mark': 'unit-circle', d: runsPath(clipPolyline(unitCircle, rect)) }),
      element('path', { class: 'curve series-sensitivityCircle', 'data-mark': 'sensitivity-circle', 'stroke-width': 1.2, d: runsPath(clipPolyline(msCircle, rect)) }),
    ]),
  );

  body.push(
    element('g', panelDataAttributes('nyquist', MAIN, sx, sy), [
      element('path', { class: 'curve mirror series-loop', 'data-series': 'loop-mirror', d: runsPath(clipPolyline(mirror, rect)) }),
      element('path', { class: 'curve series-loop', 'data-series': 'loop', d: runsPath(positiveRuns) }),
      ...arrowHeads(positiveRuns, 3, 'loop'),
    ]),
  );

  // Marks: −1, the crossovers, the closest approach to −1.
  const placer = new LabelPlacer();
  const marks: string[] = [];
  const c = toScreen(-1, 0);
  marks.push(
    element('path', { class: 'critical', 'data-mark': 'critical-point', d: `M${c.x - 6} ${c.y}L${c.x + 6} ${c.y}M${c.x} ${c.y - 6}L${c.x} ${c.y + 6}` }),
    placer.place('−1', c.x, c.y + 6, bounds, 'critical-point'),
  );
  const pm = analysis.margins.phase;
  if (pm) {
    // L(jωc) lies on the unit circle at the angle −180° + PM.
    const angle = ((-180 + pm.degrees) * Math.PI) / 180;
    const p = toScreen(Math.cos(angle), Math.sin(angle));
    const arc = arcPoints(0, 0, 1, angle < 0 ? -Math.PI : Math.PI, angle).map((q) => toScreen(q.x, q.y));
    marks.push(
      element('path', { class: 'mark', 'data-mark': 'phase-margin', 'stroke-width': 2.2, d: runsPath(clipPolyline(arc, rect)) }),
      element('circle', { class: 'mark-dot', cx: p.x, cy: p.y, r: 4 }),
      placer.place(`PM ${formatFixed(pm.degrees, 1)}° at ωc = ${formatNumber(pm.frequency)} rad/s`, p.x, p.y, bounds, 'phase-margin'),
    );
  }
  const gm = analysis.margins.gain;
  if (gm) {
    const p = toScreen(-1 / gm.ratio, 0);
    if (inside(p, rect)) {
      marks.push(
        element('circle', { class: 'mark-dot', cx: p.x, cy: p.y, r: 4 }),
        placer.place(`GM ${formatFixed(gm.db, 1)} dB at ω180 = ${formatNumber(gm.frequency)} rad/s`, p.x, p.y, bounds, 'gain-margin'),
      );
    }
  }
  const msFrequency = analysis.peaks.sensitivity.frequency;
  const f = r.frequency;
  if (msFrequency !== null && msFrequency > 0) {
    const re = interpolateLogFrequency(f, r.loop.real, msFrequency);
    const im = interpolateLogFrequency(f, r.loop.imag, msFrequency);
    if (Number.isFinite(re) && Number.isFinite(im)) {
      const p = toScreen(re, im);
      marks.push(
        element('line', { class: 'mark', 'data-mark': 'closest-approach', x1: c.x, y1: c.y, x2: p.x, y2: p.y, 'stroke-dasharray': '3 2' }),
        placer.place(`1/Ms = ${formatNumber(1 / ms)} (Ms ${formatNumber(ms)})`, (c.x + p.x) / 2, (c.y + p.y) / 2, bounds, 'sensitivity-peak'),
      );
    }
  }
  body.push(element('g', { class: 'marks', 'clip-path': `url(#${id}clip-main)` }, marks));
  body.push(overview(analysis, window, id));
  body.push(element('g', { class: 'notes' }, notes(analysis).map((text, i) => textElement(text, { class: 'note', x: MAIN.left, y: panelBottom(MAIN) + 48 + 15 * i }))));

  return svgDocument(
    {
      width: WIDTH,
      height: HEIGHT,
      idPrefix: id,
      kind: 'nyquist',
      title: 'Nyquist diagram',
      description: `L(jω) near the critical point −1 with the unit circle and the circle of radius 1/Ms = ${formatNumber(1 / ms)}; ${analysis.stability.closedLoopStable ? 'the closed loop is stable' : 'the closed loop is unstable'}.`,
    },
    body,
  );
}

/**
 * The zoom window: −1 with the sensitivity circle, the unit circle and the
 * gain-margin point, padded and made square (equal scales on both axes, so
 * circles look like circles).
 */
function zoomWindow(a: NyquistInput): Window {
  const ms = a.peaks.sensitivity.value;
  const radius = Math.min(1 / ms, ZOOM_LIMIT);
  let x0 = Math.min(-1 - radius, -1.2);
  let x1 = 1;
  let y0 = Math.min(-1, -radius);
  let y1 = Math.max(1, radius);
  const gm = a.margins.gain;
  if (gm && Math.abs(1 / gm.ratio) <= ZOOM_LIMIT) {
    x0 = Math.min(x0, -1 / gm.ratio);
    x1 = Math.max(x1, -1 / gm.ratio);
  }
  const pad = 0.12 * Math.max(x1 - x0, y1 - y0);
  x0 -= pad;
  x1 += pad;
  y0 -= pad;
  y1 += pad;
  const side = Math.max(x1 - x0, y1 - y0);
  const cx = (x0 + x1) / 2;
  const cy = (y0 + y1) / 2;
  return { x: [cx - side / 2, cx + side / 2], y: [cy - side / 2, cy + side / 2] };
}

function circlePoints(cx: number, cy: number, radius: number, n = 181): Point[] {
  return arcPoints(cx, cy, radius, 0, 2 * Math.PI, n);
}

function arcPoints(cx: number, cy: number, radius: number, from: number, to: number, n = 91): Point[] {
  return Array.from({ length: n }, (_, i) => {
    const t = from + ((to - from) * i) / (n - 1);
    return { x: cx + radius * Math.cos(t), y: cy + radius * Math.sin(t) };
  });
}

const inside = (p: Point, r: Rect) => p.x >= r.x0 && p.x <= r.x1 && p.y >= r.y0 && p.y <= r.y1;

/** z ↦ z/(1 + |z|): the whole plane into the unit disc, with infinity on its rim. */
function compress(re: number, im: number): Point {
  const m = Math.hypot(re, im);
  if (!Number.isFinite(m)) return { x: Math.cos(Math.atan2(im, re)), y: Math.sin(Math.atan2(im, re)) };
  return { x: re / (1 + m), y: im / (1 + m) };
}

function overview(a: NyquistInput, window: Window, id: string): string {
  const r = a.response!;
  const sx: Scale = linearScale([-1.08, 1.08], [OVERVIEW.left, panelRight(OVERVIEW)]);
  const sy: Scale = linearScale([-1.08, 1.08], [panelBottom(OVERVIEW), OVERVIEW.top]);
  const at = (p: Point): Point => ({ x: sx(p.x), y: sy(p.y) });
  const curve = r.loop.real.map((re, i) => at(compress(re, r.loop.imag[i])));
  const mirror = r.loop.real.map((re, i) => at(compress(re, -r.loop.imag[i])));
  const rect: Rect = { x0: OVERVIEW.left, y0: OVERVIEW.top, x1: panelRight(OVERVIEW), y1: panelBottom(OVERVIEW) };
  const ring = (radius: number) => runsPath([arcPoints(0, 0, radius, 0, 2 * Math.PI, 121).map(at)]);
  // The zoom window's outline, bent by the compression.
  const [x0, x1] = window.x;
  const [y0, y1] = window.y;
  const edge = (a0: Point, b0: Point) => Array.from({ length: 40 }, (_, i) => ({ x: a0.x + ((b0.x - a0.x) * i) / 39, y: a0.y + ((b0.y - a0.y) * i) / 39 }));
  const outline = [
    ...edge({ x: x0, y: y0 }, { x: x1, y: y0 }),
    ...edge({ x: x1, y: y0 }, { x: x1, y: y1 }),
    ...edge({ x: x1, y: y1 }, { x: x0, y: y1 }),
    ...edge({ x: x0, y: y1 }, { x: x0, y: y0 }),
  ].map((p) => at(compress(p.x, p.y)));
  const parts: string[] = [
    element('rect', { class: 'inset-frame', x: OVERVIEW.left, y: OVERVIEW.top, width: OVERVIEW.width, height: OVERVIEW.height }),
    element('path', { class: 'reference', d: ring(1), 'stroke-dasharray': '1 2', 'data-mark': 'infinity-circle' }),
    element('path', { class: 'reference', d: ring(0.5), 'data-mark': 'unit-circle' }),
    element('path', { class: 'guide', d: runsPath([outline]), 'stroke-dasharray': '2 2', 'data-mark': 'zoom-window' }),
    element('path', { class: 'curve mirror series-loop', d: runsPath(clipPolyline(mirror, rect)) }),
    element('path', { class: 'curve series-loop', 'data-series': 'loop-overview', 'stroke-width': 1.4, d: runsPath(clipPolyline(curve, rect)) }),
    ...arrowHeads(clipPolyline(curve, rect), 2, 'loop', 0.7),
  ];
  const k = a.stability.integrators;
  if (k > 0) {
    // The indentation around s = 0 maps to k clockwise half-turns at infinite radius, from L(j0−) to L(j0+).
    const start = r.loop.phaseDeg[0];
    const theta0 = ((Math.round(start / 90) * 90) * Math.PI) / 180;
    const arc = arcPoints(0, 0, 1, -theta0, -theta0 - k * Math.PI, 61 * k).map(at);
    parts.push(element('path', { class: 'curve series-loop', 'data-mark': 'integrator-arc', 'stroke-dasharray': '1 3', 'stroke-width': 1.4, d: runsPath([arc]) }));
  }
  const m1 = at({ x: -0.5, y: 0 });
  parts.push(element('path', { class: 'critical', d: `M${m1.x - 4} ${m1.y}L${m1.x + 4} ${m1.y}M${m1.x} ${m1.y - 4}L${m1.x} ${m1.y + 4}` }));
  const caption = ['overview: whole curve,', 'radius r drawn as r/(1 + r);', 'outer circle: |L| = ∞,', 'dashed: |L| = 1 and the zoom'];
  return element('g', { class: 'overview', 'data-panel': 'overview', 'clip-path': undefined }, [
    element('g', { 'clip-path': `url(#${id}clip-overview)` }, parts),
    ...caption.map((text, i) => textElement(text, { class: 'note', x: OVERVIEW.left, y: panelBottom(OVERVIEW) + 16 + 14 * i })),
  ]);
}

/** N counted clockwise; a negative count reads better as counter-clockwise turns. */
function encirclements(n: number): string {
  return n >= 0 ? `N = ${n} clockwise encirclement(s) of −1` : `N = −${-n} (${-n} counter-clockwise encirclement(s) of −1)`;
}

function notes(a: NyquistInput): string[] {
  const s = a.stability;
  const out = [
    `Nyquist criterion: ${encirclements(s.nyquist.clockwiseEncirclements)}, P = ${s.openLoopUnstablePoles} open-loop unstable pole(s)${s.openLoopUnstablePolesAssumed ? ' (assumed)' : ''}, Z = N + P = ${s.nyquist.closedLoopUnstablePoles}: the closed loop is ${s.closedLoopStable ? 'stable' : 'unstable'}.`,
  ];
  if (s.integrators > 0) {
    out.push(`${s.integrators} integrator(s): the contour closes through ${s.integrators} half-turn(s) at infinite radius (dotted in the overview).`);
  }
  out.push(`Arrows point toward increasing frequency; thin curve: ω < 0 (mirror image). Sweep checked up to ${formatNumber(s.nyquist.sweepTo)} rad/s.`);
  return out;
}
