/**
 * The Bode figure against closed-form results for L(s) = 2/(s + 1)³
 * (common practice, worked by hand): the phase −3·atan ω reaches −180° at
 * ω180 = √3 rad/s where |L| = 2/8, so GM = 4 (12.04 dB); |L| = 1 at
 * ωc = √(2^{2/3} − 1) = 0.7664 rad/s, where PM = 180° − 3·atan ωc = 67.6°.
 * The drawn curves, mapped back through the panel's axes, must be
 * 20·log10(2/(1 + ω²)^{3/2}) and −3·atan ω.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { renderBodePlot } from '../../src/render/bode-figure.js';
import { allText, byAttr, curveData, findAll, parseXml } from './support/svg-tree.js';

const request = { plant: { kind: 'transfer-function', numerator: [2], denominator: [1, 3, 3, 1] } };
const analysis = analyze(request);
const svg = renderBodePlot(analysis);
const doc = parseXml(svg);

const magnitudeDb = (w: number) => 20 * Math.log10(2 / Math.pow(1 + w * w, 1.5));
const phaseDeg = (w: number) => (-3 * Math.atan(w) * 180) / Math.PI;

describe('renderBodePlot', () => {
  it('is well-formed SVG with a title, a description and axis titles with units', () => {
    const root = doc.children[0];
    expect(root.name).toBe('svg');
    expect(root.attrs.xmlns).toBe('http://www.w3.org/2000/svg');
    const texts = allText(doc);
    expect(texts).toContain('magnitude (dB)');
    expect(texts).toContain('phase (°)');
    expect(texts).toContain('frequency ω (rad/s)');
    expect(findAll(doc, (n) => n.name === 'desc').length).toBe(1);
  });

  it('labels decades on the frequency axis', () => {
    const texts = allText(doc);
    for (const label of ['0.1', '1', '10']) expect(texts).toContain(label);
  });

  it('draws |L| and ∠L where the closed form puts them', () => {
    const mag = findAll(doc, byAttr('data-panel', 'magnitude'))[0];
    const ph = findAll(doc, byAttr('data-panel', 'phase'))[0];
    const magPoints = curveData(mag, findAll(mag, byAttr('data-series', 'loop-magnitude'))[0]);
    const phPoints = curveData(ph, findAll(ph, byAttr('data-series', 'loop-phase'))[0]);
    expect(magPoints.length).toBeGreaterThan(100);
    expect(phPoints.length).toBeGreaterThan(100);
    for (const p of magPoints) expect(Math.abs(p.y - magnitudeDb(p.x))).toBeLessThan(0.05);
    for (const p of phPoints) expect(Math.abs(p.y - phaseDeg(p.x))).toBeLessThan(0.05);
  });

  it('draws |S| and |T| by default and leaves them out on request', () => {
    expect(findAll(doc, byAttr('data-series', 'sensitivity-magnitude')).length).toBe(1);
    expect(findAll(doc, byAttr('data-series', 'complementary-magnitude')).length).toBe(1);
    const loopOnly = parseXml(renderBodePlot(analysis, { closedLoop: false }));
    expect(findAll(loopOnly, byAttr('data-series', 'sensitivity-magnitude')).length).toBe(0);
  });

  it('marks and labels the margins with the closed-form values', () => {
    const gm = findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === 'gain-margin');
    const pm = findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === 'phase-margin');
    expect(gm.length).toBe(1);
    expect(pm.length).toBe(1);
    // 20·log10(4) = 12.04 dB at √3 = 1.732 rad/s; PM = 180 − 3·atan(0.7664) = 67.6°.
    expect(gm[0].children[0].text).toBe('GM 12.0 dB (×4) at ω180 = 1.73 rad/s');
    expect(pm[0].children[0].text).toMatch(/^PM 67\.6° at ωc = 0\.766 rad\/s, delay margin 1\.54 s$/);
    expect(findAll(doc, byAttr('data-mark', 'gain-crossover')).length).toBe(1);
    expect(findAll(doc, byAttr('data-mark', 'phase-crossover')).length).toBe(1);
  });

  it('labels the sensitivity peaks with the values the analysis returns', () => {
    const ms = findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === 'sensitivity-peak')[0];
    expect(ms.children[0].text).toContain(`Ms ${analysis.peaks.sensitivity.value.toPrecision(3)}`);
  });

  it('refuses an analysis without the response arrays', () => {
    const summary = analyze({ ...request, detail: 'summary' });
    expect(() => renderBodePlot(summary)).toThrow(/frequency response/);
  });
});
