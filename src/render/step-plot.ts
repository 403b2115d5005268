/**
 * The time-response figure: the output after a unit setpoint step with its
 * final value, the ±2 % settling band, the overshoot and the settling time
 * marked; the controller output for that step; and the output after a unit
 * load step at the plant input with its peak deviation marked. Figures come
 * from the analysis (the simulation's exact final values and refined
 * crossings), never from the plotted samples.
 */
import type { TimeResponse } from '../contract/schemas/time-response.js';
import { drawAxes } from './axes/draw-axes.js';
import { drawLegend } from './axes/legend.js';
import { linearTicks } from './axes/linear-ticks.js';
import { clipPathFor, panelBottom, panelRight, type Panel } from './axes/panel.js';
import { panelDataAttributes } from './axes/panel-data.js';
import { linearScale, type Scale } from './axes/scale.js';
import { formatFixed, formatNumber } from './format-number.js';
import { LabelPlacer, type Bounds } from './marks.js';
import { clipPolyline, type Rect } from './svg/clip-polyline.js';
import { element, textElement } from './svg/element.js';
import { runsPath } from './svg/path-data.js';
import { svgDocument } from './svg/svg-document.js';
import type { SeriesName } from './style/palette.js';

export interface StepPlotOptions {
  idPrefix?: string;
  title?: string;
  /** Units for the axis titles, e.g. { input: 'drive command, %', output: 'pump speed, %' }. */
  units?: { input?: string; output?: string };
}

const WIDTH = 760;
const HEIGHT = 720;
const SETPOINT: Panel = { left: 84, top: 84, width: 640, height: 220 };
const CONTROL: Panel = { left: 84, top: 352, width: 640, height: 110 };
const LOAD: Panel = { left: 84, top: 510, width: 640, height: 150 };
/** ±2 % settling band (the simulation's definition). */
const SETTLING_BAND = 0.02;

export function renderStepPlot(response: TimeResponse, options: StepPlotOptions = {}): string {
  const id = options.idPrefix ?? 'step-';
  const sp = response.setpoint;
  const ld = response.loadDisturbance;
  const t = sp.time;
  const x = linearScale([t[0], t[t.length - 1]], [SETPOINT.left, panelRight(SETPOINT)]);
  const xt = linearTicks(t[0], t[t.length - 1], 8);
  const xMajor = xt.values.filter((v) => v <= t[t.length - 1] + 1e-12);
  const out = options.units?.output ? ` (${options.units.output})` : '';
  const inp = options.units?.input ? ` (${options.units.input})` : '';

  const body: string[] = [
    element('defs', {}, [clipPathFor(`${id}clip-sp`, SETPOINT), clipPathFor(`${id}clip-u`, CONTROL), clipPathFor(`${id}clip-ld`, LOAD)]),
    textElement(options.title ?? 'Closed-loop time responses', { class: 'plot-title', x: SETPOINT.left, y: 24 }),
    drawLegend(
      [
        { series: 'loop', label: 'y after a unit setpoint step' },
        { series: 'control', label: 'u, controller output' },
        { series: 'loadResponse', label: 'y after a unit load step at the plant input' },
      ],
      SETPOINT.left,
      48,
    ),
  ];

  const spLevels = [...sp.output, 0, sp.finalValue ?? 0];
  const spAxis = axisFor(spLevels, SETPOINT);
  const uAxis = axisFor([...sp.control, 0], CONTROL);
  const ldAxis = axisFor([...ld.output, 0], LOAD);
  const xAxis = (labels: boolean, title?: string) => ({ scale: x, major: xMajor, label: labels ? (v: number) => formatNumber(v) : () => '', title });
  body.push(
    drawAxes(SETPOINT, xAxis(true), { scale: spAxis.scale, major: spAxis.ticks, label: (v) => formatNumber(v), title: 'y' }, 'setpoint'),
    drawAxes(CONTROL, xAxis(true), { scale: uAxis.scale, major: uAxis.ticks, label: (v) => formatNumber(v), title: 'u' }, 'control'),
    drawAxes(LOAD, xAxis(true, 'time t (s)'), { scale: ldAxis.scale, major: ldAxis.ticks, label: (v) => formatNumber(v), title: 'y' }, 'load'),
    heading(`Unit setpoint step: output y${out}`, SETPOINT),
    heading(`Same step: controller output u${inp}`, CONTROL),
    heading(`Unit load step at the plant input (setpoint 0): output y${out}`, LOAD),
  );

  const curve = (panel: Panel, y: Scale, values: readonly number[], series: SeriesName, name: string, clip: string) =>
    element('path', {
      class: `curve series-${series}`,
      'data-series': name,
      'clip-path': `url(#${clip})`,
      d: runsPath(clipPolyline(t.map((ti, i) => ({ x: x(ti), y: y(values[i]) })), rectOf(panel))),
    });

  const placer = new LabelPlacer();
  const spMarks: string[] = [];
  if (sp.finalValue !== null) {
    const yf = spAxis.scale(sp.finalValue);
    const band = Math.abs(sp.finalValue) * SETTLING_BAND;
    const top = spAxis.scale(sp.finalValue + band);
    const bottom = spAxis.scale(sp.finalValue - band);
    spMarks.push(
      element('rect', { class: 'band', 'data-mark': 'settling-band', x: SETPOINT.left, width: SETPOINT.width, y: Math.min(top, bottom), height: Math.abs(bottom - top) }),
      element('line', { class: 'reference', 'data-mark': 'final-value', x1: SETPOINT.left, x2: panelRight(SETPOINT), y1: yf, y2: yf }),
    );
  }
  spMarks.push(element('line', { class: 'reference', x1: SETPOINT.left, x2: panelRight(SETPOINT), y1: spAxis.scale(0), y2: spAxis.scale(0), 'stroke-dasharray': '1 3' }));
  body.push(element('g', { class: 'setpoint-marks', 'clip-path': `url(#${id}clip-sp)` }, spMarks));
  body.push(element('g', panelDataAttributes('setpoint', SETPOINT, x, spAxis.scale), [curve(SETPOINT, spAxis.scale, sp.output, 'loop', 'setpoint-output', `${id}clip-sp`)]));
  body.push(element('g', panelDataAttributes('control', CONTROL, x, uAxis.scale), [curve(CONTROL, uAxis.scale, sp.control, 'control', 'setpoint-control', `${id}clip-u`)]));
  body.push(element('g', panelDataAttributes('load', LOAD, x, ldAxis.scale), [
    element('line', { class: 'reference', x1: LOAD.left, x2: panelRight(LOAD), y1: ldAxis.scale(0), y2: ldAxis.scale(0), 'stroke-dasharray': '1 3' }),
    curve(LOAD, ldAxis.scale, ld.output, 'loadResponse', 'load-output', `${id}clip-ld`),
  ]));

  const marks: string[] = [];
  const spBounds = boundsOf(SETPOINT);
  if (sp.finalValue !== null && sp.overshootPercent !== null) {
    if (sp.peakTime !== null && sp.overshootPercent > 0) {
      const peak = sp.finalValue * (1 + (Math.sign(sp.finalValue) * sp.overshootPercent) / 100);
      const px = x(sp.peakTime);
      const py = spAxis.scale(peak);
      marks.push(
        element('line', { class: 'mark', 'data-mark': 'overshoot', x1: px, x2: px, y1: spAxis.scale(sp.finalValue), y2: py, 'stroke-width': 2.2 }),
        element('circle', { class: 'mark-dot', cx: px, cy: py, r: 3.5 }),
        placer.place(`overshoot ${formatFixed(sp.overshootPercent, 1)} % at ${formatNumber(sp.peakTime)} s`, px, py, spBounds, 'overshoot'),
      );
    } else {
      marks.push(placer.place('no overshoot', SETPOINT.left + 8, SETPOINT.top + 14, spBounds, 'overshoot'));
    }
  }
  if (sp.settlingTime !== null && sp.finalValue !== null) {
    const sx = x(sp.settlingTime);
    marks.push(
      element('line', { class: 'mark', 'data-mark': 'settling-time', x1: sx, x2: sx, y1: SETPOINT.top, y2: panelBottom(SETPOINT), 'stroke-dasharray': '4 3' }),
      placer.place(`settled within ±2 % from ${formatNumber(sp.settlingTime)} s`, sx, spAxis.scale(sp.finalValue) + 18, spBounds, 'settling-time'),
    );
  }
  const summary = [
    sp.riseTime !== null ? `rise time (10–90 %) ${formatNumber(sp.riseTime)} s` : 'rise time: not reached',
    sp.steadyStateError !== null ? `steady-state error ${formatNumber(roundTiny(sp.steadyStateError))}` : '',
  ].filter(Boolean);
  marks.push(textElement(summary.join('; '), { class: 'legend-label', 'data-mark': 'setpoint-summary', x: panelRight(SETPOINT) - 6, y: panelBottom(SETPOINT) - 8, 'text-anchor': 'end' }));

  if (ld.peakDeviation !== null && ld.peakDeviationTime !== null) {
    const px = x(ld.peakDeviationTime);
    // peakDeviation is max |y|; the sign is that of the sample nearest to its time.
    const nearest = t.reduce((best, ti, i) => (Math.abs(ti - ld.peakDeviationTime!) < Math.abs(t[best] - ld.peakDeviationTime!) ? i : best), 0);
    const signed = Math.sign(ld.output[nearest] || 1) * ld.peakDeviation;
    const py = ldAxis.scale(signed);
    marks.push(
      element('line', { class: 'mark', 'data-mark': 'peak-deviation', x1: px, x2: px, y1: ldAxis.scale(0), y2: py, 'stroke-width': 2.2 }),
      element('circle', { class: 'mark-dot', cx: px, cy: py, r: 3.5 }),
      placer.place(`peak deviation ${formatNumber(ld.peakDeviation)} at ${formatNumber(ld.peakDeviationTime)} s`, px, py, boundsOf(LOAD), 'peak-deviation'),
    );
  }
  if (ld.iae !== null) {
    marks.push(textElement(`IAE ${formatNumber(ld.iae)} (∫|y| dt over ${formatNumber(response.duration)} s)`, { class: 'legend-label', 'data-mark': 'iae', x: panelRight(LOAD) - 6, y: panelBottom(LOAD) - 8, 'text-anchor': 'end' }));
  }
  body.push(element('g', { class: 'marks' }, marks));
  if (!response.stable) {
    body.push(textElement('The closed loop is unstable: the responses diverge and have no figures.', { class: 'note', 'data-mark': 'unstable', x: SETPOINT.left, y: HEIGHT - 20 }));
  } else if (response.notes.length) {
    body.push(textElement(response.notes[0], { class: 'note', x: SETPOINT.left, y: HEIGHT - 20 }));
  }

  return svgDocument(
    {
      width: WIDTH,
      height: HEIGHT,
      idPrefix: id,
      kind: 'step',
      title: 'Closed-loop time responses',
      description: response.stable
        ? `Unit setpoint step: overshoot ${sp.overshootPercent === null ? 'n/a' : `${formatFixed(sp.overshootPercent, 1)} %`}, settling time ${sp.settlingTime === null ? 'n/a' : `${formatNumber(sp.settlingTime)} s`}; unit load step: peak deviation ${ld.peakDeviation === null ? 'n/a' : formatNumber(ld.peakDeviation)}.`
        : 'The closed loop is unstable; the responses diverge.',
    },
    body,
  );
}

/** A vertical axis covering the values with a little room above and below. */
function axisFor(values: readonly number[], panel: Panel): { scale: Scale; ticks: number[] } {
  const finite = values.filter(Number.isFinite);
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.06;
  lo -= pad;
  hi += pad;
  const ticks = linearTicks(lo, hi, panel.height > 160 ? 6 : 3);
  return { scale: linearScale([ticks.lo, ticks.hi], [panelBottom(panel), panel.top]), ticks: ticks.values };
}

const heading = (text: string, p: Panel) => textElement(text, { class: 'axis-title', x: p.left, y: p.top - 8 });
const rectOf = (p: Panel): Rect => ({ x0: p.left, y0: p.top, x1: panelRight(p), y1: panelBottom(p) });
const boundsOf = (p: Panel): Bounds => ({ left: p.left, right: panelRight(p), top: p.top, bottom: panelBottom(p) });
/** A steady-state error of 1e−16 from an integrating controller is zero in print. */
const roundTiny = (v: number) => (Math.abs(v) < 1e-12 ? 0 : v);
