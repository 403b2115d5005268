/**
 * The time-response figure, fed with the closed-form step response of
 * T(s) = 1/(s² + s + 1) (ζ = 0.5, ωn = 1; Ogata, Modern Control Engineering,
 * 5th ed., §5-3): y = 1 − e^{−t/2}(cos ωd t + sin(ωd t)/√3), ωd = √3/2,
 * overshoot e^{−π/√3} = 16.30 %, peak time π/ωd = 3.628 s. The drawn curve
 * mapped back through the axes must be that y, and the labels must show the
 * figures given.
 */
import { describe, expect, it } from 'vitest';
import type { TimeResponse } from '../../src/contract/schemas/time-response.js';
import { renderStepPlot } from '../../src/render/step-plot.js';
import { allText, byAttr, curveData, findAll, parseXml } from './support/svg-tree.js';

const wd = Math.sqrt(3) / 2;
const y = (t: number) => 1 - Math.exp(-t / 2) * (Math.cos(wd * t) + Math.sin(wd * t) / Math.sqrt(3));
const time = Array.from({ length: 401 }, (_, i) => (20 * i) / 400);
const overshoot = 100 * Math.exp(-Math.PI / Math.sqrt(3));
const response: TimeResponse = {
  stable: true,
  duration: 20,
  method: 'closed form',
  notes: [],
  setpoint: {
    time,
    output: time.map(y),
    control: time.map((t) => 1 - y(t)),
    finalValue: 1,
    overshootPercent: overshoot,
    peakTime: Math.PI / wd,
    riseTime: 1.64,
    settlingTime: 8.08,
    steadyStateError: 0,
  },
  loadDisturbance: {
    time,
    output: time.map(y),
    control: time.map((t) => -y(t)),
    finalValue: 1,
    peakDeviation: 1 + overshoot / 100,
    peakDeviationTime: Math.PI / wd,
    iae: 19.0,
  },
};

const doc = parseXml(renderStepPlot(response, { units: { input: 'drive command, %', output: 'pump speed, %' } }));
const markText = (mark: string) => findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === mark)[0]?.children[0].text;

describe('renderStepPlot', () => {
  it('is well-formed SVG with time in seconds and the units given', () => {
    expect(doc.children[0].name).toBe('svg');
    const texts = allText(doc);
    expect(texts).toContain('time t (s)');
    expect(texts).toContain('Unit setpoint step: output y (pump speed, %)');
    expect(texts).toContain('Same step: controller output u (drive command, %)');
  });

  it('draws the setpoint response where the closed form puts it', () => {
    const panel = findAll(doc, byAttr('data-panel', 'setpoint'))[0];
    const points = curveData(panel, findAll(panel, byAttr('data-series', 'setpoint-output'))[0]);
    expect(points.length).toBe(time.length);
    for (const p of points) expect(Math.abs(p.y - y(p.x))).toBeLessThan(1e-3);
  });

  it('draws the controller output and the load response', () => {
    expect(findAll(doc, byAttr('data-series', 'setpoint-control')).length).toBe(1);
    expect(findAll(doc, byAttr('data-series', 'load-output')).length).toBe(1);
  });

  it('marks overshoot and settling with the figures given', () => {
    expect(markText('overshoot')).toBe('overshoot 16.3 % at 3.63 s');
    expect(markText('settling-time')).toBe('settled within ±2 % from 8.08 s');
    expect(findAll(doc, byAttr('data-mark', 'settling-band')).length).toBe(1);
    expect(markText('setpoint-summary')).toBe('rise time (10–90 %) 1.64 s; steady-state error 0');
    expect(markText('peak-deviation')).toBe('peak deviation 1.16 at 3.63 s');
    expect(markText('iae')).toContain('IAE 19');
  });

  it('says so when the loop is unstable and has no figures', () => {
    const unstable: TimeResponse = {
      ...response,
      stable: false,
      setpoint: { ...response.setpoint, finalValue: null, overshootPercent: null, peakTime: null, riseTime: null, settlingTime: null, steadyStateError: null },
      loadDisturbance: { ...response.loadDisturbance, finalValue: null, peakDeviation: null, peakDeviationTime: null, iae: null },
    };
    const d = parseXml(renderStepPlot(unstable));
    expect(findAll(d, byAttr('data-mark', 'unstable')).length).toBe(1);
    expect(findAll(d, byAttr('data-mark', 'overshoot')).length).toBe(0);
  });
});
