/**
 * The plot routes over HTTP: SVG content type, well-formed XML, the curves
 * and the labels with the figures POST /v1/analyses returns for the same
 * body, and catalogue errors for what cannot be drawn.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP } from '../../src/demo/bottling-plant.js';
import { formatFixed, formatNumber } from '../../src/render/format-number.js';
import { byAttr, findAll, parseXml } from '../render/support/svg-tree.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp();
});
afterAll(async () => {
  await app.close();
});

const post = (url: string, payload: unknown) =>
  app.inject({ method: 'POST', url, payload: JSON.stringify(payload), headers: { 'content-type': 'application/json' } });

const label = (doc: ReturnType<typeof parseXml>, mark: string) =>
  findAll(doc, (n) => n.name === 'text' && n.attrs['data-mark'] === mark)[0]?.children[0].text;

describe('POST /v1/plots/*', () => {
  it('draws the Bode figure of a demo loop with the API\'s margins', async () => {
    const body = PASTEURISER_TEMPERATURE_LOOP.request;
    const [plot, analysis] = await Promise.all([post('/v1/plots/bode', body), post('/v1/analyses', body)]);
    expect(plot.statusCode).toBe(200);
    expect(plot.headers['content-type']).toMatch(/^image\/svg\+xml/);
    const a = analysis.json();
    const doc = parseXml(plot.body);
    expect(findAll(doc, byAttr('data-series', 'loop-magnitude')).length).toBe(1);
    expect(label(doc, 'gain-margin')).toBe(
      `GM ${formatFixed(a.margins.gain.db, 1)} dB (×${formatNumber(a.margins.gain.ratio)}) at ω180 = ${formatNumber(a.margins.gain.frequency)} rad/s`,
    );
    expect(label(doc, 'phase-margin')).toContain(`PM ${formatFixed(a.margins.phase.degrees, 1)}° at ωc = ${formatNumber(a.margins.phase.frequency)} rad/s`);
  });

  it('leaves |S| and |T| off with ?closedLoop=false', async () => {
    const res = await post('/v1/plots/bode?closedLoop=false', FILLER_PUMP_SPEED_LOOP.request);
    expect(findAll(parseXml(res.body), byAttr('data-series', 'sensitivity-magnitude')).length).toBe(0);
  });

  it('draws the Nyquist figure even when the request asks for a summary', async () => {
    const res = await post('/v1/plots/nyquist', { ...FILLER_PUMP_SPEED_LOOP.request, detail: 'summary' });
    expect(res.statusCode).toBe(200);
    const doc = parseXml(res.body);
    expect(findAll(doc, byAttr('data-series', 'loop')).length).toBe(1);
    expect(findAll(doc, byAttr('data-mark', 'sensitivity-circle')).length).toBe(1);
  });

  it('draws the step figure with the overshoot the analysis reports', async () => {
    const body = { ...FILLER_PUMP_SPEED_LOOP.request, timeResponse: { points: 600 } };
    const [plot, analysis] = await Promise.all([post('/v1/plots/step', body), post('/v1/analyses', body)]);
    expect(plot.statusCode).toBe(200);
    const sp = analysis.json().timeResponse.setpoint;
    const doc = parseXml(plot.body);
    expect(label(doc, 'overshoot')).toBe(`overshoot ${formatFixed(sp.overshootPercent, 1)} % at ${formatNumber(sp.peakTime)} s`);
    expect(label(doc, 'settling-time')).toBe(`settled within ±2 % from ${formatNumber(sp.settlingTime)} s`);
  });

  it('answers 422 time_response_unavailable for a step plot of an expression plant', async () => {
    const res = await post('/v1/plots/step', { plant: { kind: 'expression', expression: 'exp(-s)/(s+1)' }, controller: { kind: 'pid', form: 'standard', gain: 0.5, integralTime: 1 } });
    expect(res.statusCode).toBe(422);
    expect(res.json().code).toBe('time_response_unavailable');
  });

  it('answers 400 with the field path for a bad body, as the analysis does', async () => {
    const res = await post('/v1/plots/bode', { plant: { kind: 'transfer-function', numerator: 'x', denominator: [1] } });
    expect(res.statusCode).toBe(400);
    expect(res.json().issues[0].path).toEqual(['plant', 'numerator']);
  });
});
