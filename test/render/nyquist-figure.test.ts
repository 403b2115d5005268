/**
 * The Nyquist figure against closed forms (common practice, worked by
 * hand). For L(s) = 2/(s + 1)³, every point drawn must satisfy
 * |L| = 2/(1 + ω²)^{3/2} with ω = tan(−∠L/3); the gain-margin point is
 * −1/GM = −1/4 and the phase-margin point is e^{j(−180° + PM)} on the unit
 * circle. For L(s) = 1/(s(s + 1)) (one integrator) the overview closes the
 * contour with a half-turn at infinite radius.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { renderNyquistPlot } from '../../src/render/nyquist-figure.js';
import { parsePolylinePath } from '../../src/render/svg/path-data.js';
import { allText, byAttr, curveData, findAll, parseXml } from './support/svg-tree.js';

const lag = analyze({ plant: { kind: 'transfer-function', numerator: [2], denominator: [1, 3, 3, 1] } });
const doc = parseXml(renderNyquistPlot(lag));
const panel = findAll(doc, byAttr('data-panel', 'nyquist'))[0];

describe('renderNyquistPlot', () => {
  it('is well-formed SVG with labelled axes', () => {
    expect(doc.children[0].name).toBe('svg');
    const texts = allText(doc);
    expect(texts).toContain('Re L(jω)');
    expect(texts).toContain('Im L(jω)');
  });

  it('draws L(jω) where the closed form puts it', () => {
    const points = curveData(panel, findAll(panel, byAttr('data-series', 'loop'))[0]);
    expect(points.length).toBeGreaterThan(50);
    for (const p of points) {
      const arg = Math.atan2(p.y, p.x);
      // ∠L runs from 0 to −270°; atan2 wraps below −180° to positive angles.
      const phase = arg > 0 ? arg - 2 * Math.PI : arg;
      const w = Math.tan(-phase / 3);
      const expected = 2 / Math.pow(1 + w * w, 1.5);
      expect(Math.abs(Math.hypot(p.x, p.y) - expected)).toBeLessThan(2e-3);
    }
  });

  it('zooms on −1: the window holds −1, the unit circle and the sensitivity circle, with equal scales', () => {
    const [, x0, x1] = panel.attrs['data-x'].split(' ').map(Number);
    const [, y0, y1] = panel.attrs['data-y'].split(' ').map(Number);
    expect(x0).toBeLessThan(-1 - 1 / lag.peaks.sensitivity.value);
    expect(x1).toBeGreaterThanOrEqual(1);
    expect(y0).toBeLessThanOrEqual(-1);
    expect(y1).toBeGreaterThanOrEqual(1);
    expect(x1 - x0).toBeCloseTo(y1 - y0, 12);
    expect(x1 - x0).toBeLessThan(6);
  });

  it('draws the sensitivity circle with radius 1/Ms around −1', () => {
    const circle = findAll(doc, byAttr('data-mark', 'sensitivity-circle'))[0];
    const points = curveData(panel, circle);
    for (const p of points) expect(Math.hypot(p.x + 1, p.y)).toBeCloseTo(1 / lag.peaks.sensitivity.value, 2);
  });

  it('marks −1 and labels the margins at their closed-form points', () => {
    expect(findAll(doc, byAttr('data-mark', 'critical-point')).length).toBeGreaterThan(0);
    const gm = findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === 'gain-margin')[0];
    expect(gm.children[0].text).toBe('GM 12.0 dB at ω180 = 1.73 rad/s');
    const pm = findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === 'phase-margin')[0];
    expect(pm.children[0].text).toBe('PM 67.6° at ωc = 0.766 rad/s');
  });

  it('puts arrows for increasing frequency along the curve, pointing the way ω grows', () => {
    const arrows = findAll(panel, byAttr('data-mark', 'frequency-arrow'));
    expect(arrows.length).toBe(3);
    // For this lag the curve turns clockwise (∠L decreasing): the arrows' direction must agree with the samples' order.
    const run = parsePolylinePath(findAll(panel, byAttr('data-series', 'loop'))[0].attrs.d).flat();
    for (const a of arrows) {
      const m = /translate\(([-\d.]+) ([-\d.]+)\) rotate\(([-\d.]+)\)/.exec(a.attrs.transform)!;
      const [x, y, deg] = [Number(m[1]), Number(m[2]), Number(m[3])];
      let k = 0;
      for (let i = 1; i < run.length; i++) if (Math.hypot(run[i].x - x, run[i].y - y) < Math.hypot(run[k].x - x, run[k].y - y)) k = i;
      const next = run[Math.min(k + 1, run.length - 1)];
      const prev = run[Math.max(k - 1, 0)];
      const along = Math.cos((deg * Math.PI) / 180) * (next.x - prev.x) + Math.sin((deg * Math.PI) / 180) * (next.y - prev.y);
      expect(along).toBeGreaterThan(0);
    }
  });

  it('closes the contour of an integrating loop at infinity in the overview', () => {
    const integrating = analyze({ plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 1, 0] } });
    expect(integrating.stability.integrators).toBe(1);
    const d = parseXml(renderNyquistPlot(integrating));
    expect(findAll(d, byAttr('data-mark', 'integrator-arc')).length).toBe(1);
    expect(allText(d).some((t) => t.startsWith('1 integrator(s)'))).toBe(true);
    // Without an integrator there is no arc.
    expect(findAll(doc, byAttr('data-mark', 'integrator-arc')).length).toBe(0);
  });

  it('states the Nyquist count the analysis found', () => {
    const s = lag.stability;
    expect(allText(doc).some((t) => t.includes(`N = ${s.nyquist.clockwiseEncirclements} clockwise`) && t.includes('stable'))).toBe(true);
  });
});

describe('renderNyquistPlot for an open-loop unstable plant', () => {
  // C = 3(1 + 1/(2s)), P = 1/(s − 1): the characteristic polynomial 2s(s − 1) + 3(2s + 1) = 2s² + 4s + 3 is Hurwitz (closed form),
  // and with one open-loop unstable pole that takes one counter-clockwise turn (Z = N + P = −1 + 1 = 0).
  const a = analyze({ plant: { kind: 'transfer-function', numerator: [1], denominator: [1, -1] }, controller: { kind: 'pid', form: 'standard', gain: 3, integralTime: 2 } });
  it('states the counter-clockwise encirclement and labels the gain-reduction margin', () => {
    expect(a.stability.closedLoopStable).toBe(true);
    const d = parseXml(renderNyquistPlot(a));
    expect(allText(d).some((t) => t.startsWith('Nyquist criterion: N = −1 (1 counter-clockwise encirclement(s) of −1), P = 1'))).toBe(true);
    const gm = findAll(d, (n) => n.name === 'text' && n.attrs['data-mark'] === 'gain-margin')[0];
    expect(gm.children[0].text).toMatch(/^GM −\d/);
  });
});
