/**
 * POST /v1/reports: a self-contained HTML page whose figures are the ones
 * POST /v1/analyses returns for the same body (compared number for number
 * through the data-value attributes), marked against the criteria, with
 * the three plots, the warnings, the safety caution, version and hash.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { SAFETY_CAUTION } from '../../src/contract/caution.js';
import { FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP } from '../../src/demo/bottling-plant.js';
import { formatFixed } from '../../src/render/format-number.js';
import { VERSION } from '../../src/version.js';
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

/** The value cell of a figure row: [data-value, shown text]. */
function figure(html: string, key: string): [string, string] {
  const m = new RegExp(`data-figure="${key}" data-value="([^"]*)">([^<]*)<`).exec(html);
  if (!m) throw new Error(`no figure ${key}`);
  return [m[1], m[2]];
}
const markOf = (html: string, key: string) => new RegExp(`<tr data-row="${key}">.*?data-mark="(\\w+)"`).exec(html)?.[1];

describe('POST /v1/reports', () => {
  const body = PASTEURISER_TEMPERATURE_LOOP.request;

  it('is one self-contained HTML page: no scripts, no external assets, a strict CSP', async () => {
    const res = await post('/v1/reports', body);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['content-security-policy']).toContain("default-src 'none'");
    const html = res.body;
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).not.toMatch(/<script|<link|<img|<iframe|\ssrc=|url\(http|@import/i);
    // The only URL is the SVG namespace name, which is never fetched.
    expect(html.replaceAll('xmlns="http://www.w3.org/2000/svg"', '')).not.toMatch(/https?:\/\//);
  });

  it('states the margins, peaks and hash that POST /v1/analyses returns', async () => {
    const [report, analysis] = await Promise.all([post('/v1/reports', body), post('/v1/analyses', body)]);
    const html = report.body;
    const a = analysis.json();
    expect(figure(html, 'minGainMarginDb')[0]).toBe(String(a.margins.gain.db));
    expect(figure(html, 'minGainMarginDb')[1]).toContain(`${formatFixed(a.margins.gain.db, 2)} dB`);
    expect(figure(html, 'minPhaseMarginDegrees')[0]).toBe(String(a.margins.phase.degrees));
    expect(figure(html, 'minPhaseMarginDegrees')[1]).toContain(`${formatFixed(a.margins.phase.degrees, 2)}°`);
    expect(figure(html, 'minDelayMarginSeconds')[0]).toBe(String(a.margins.delay.seconds));
    expect(figure(html, 'maxSensitivityPeak')[0]).toBe(String(a.peaks.sensitivity.value));
    expect(figure(html, 'maxComplementaryPeak')[0]).toBe(String(a.peaks.complementarySensitivity.value));
    expect(figure(html, 'crossoverFrequency')[0]).toBe(String(a.bandwidth.crossover));
    expect(html).toContain(`data-request-hash="${a.requestHash}"`);
    expect(html).toContain(`loopgate ${VERSION}`);
    expect(html).toContain(SAFETY_CAUTION);
  });

  it('keeps the analysis hash when report options are added', async () => {
    const [report, analysis] = await Promise.all([post('/v1/reports', { ...body, report: { title: 'Pasteuriser review' } }), post('/v1/analyses', body)]);
    expect(report.body).toContain(`data-request-hash="${analysis.json().requestHash}"`);
    expect(report.body).toContain('<h1>Pasteuriser review</h1>');
  });

  it('embeds the three plots as well-formed SVG', async () => {
    const html = (await post('/v1/reports', FILLER_PUMP_SPEED_LOOP.request)).body;
    const svgs = [...html.matchAll(/<svg[\s\S]*?<\/svg>/g)].map((m) => parseXml(m[0]));
    expect(svgs.map((d) => d.children[0].attrs['data-plot'])).toEqual(['bode', 'nyquist', 'step']);
    expect(findAll(svgs[2], byAttr('data-series', 'setpoint-output')).length).toBe(1);
  });

  it('marks each figure pass, warn or fail against the profile', async () => {
    const base = (await post('/v1/reports', body)).body;
    expect(markOf(base, 'maxSensitivityPeak')).toBe('pass');
    expect(markOf(base, 'minDelayMarginSeconds')).toBe('none');
    // Ms = 1.72 is above the plant-changes profile's 1.4: a failure there.
    const strict = (await post('/v1/reports', { ...body, report: { profile: 'plant-changes' } })).body;
    expect(markOf(strict, 'maxSensitivityPeak')).toBe('fail');
    expect(strict).toContain('data-verdict="fail"');
    // The request's own criteria override the profile: Mt ≤ 1.01 warns (Mt warns only in the baseline).
    const mt = (await post('/v1/reports', { ...body, criteria: { maxComplementaryPeak: 1.01 } })).body;
    expect(markOf(mt, 'maxComplementaryPeak')).toBe('warn');
    expect(mt).toContain('data-verdict="warn"');
  });

  it('fails an unstable loop and lists its warnings with their sources', async () => {
    // 10/(s + 1)³: the phase crossover at √3 rad/s has |L| = 10/8 > 1 (closed form), so the loop is unstable.
    const html = (await post('/v1/reports', { plant: { kind: 'transfer-function', numerator: [10], denominator: [1, 3, 3, 1] } })).body;
    expect(markOf(html, 'closedLoopStable')).toBe('fail');
    expect(html).toContain('data-verdict="fail"');
    expect(html).toContain('data-warning="closed_loop_unstable"');
    expect(html).toContain('Source: Åström &amp; Murray');
  });

  it('says why there is no step figure for an expression plant, and escapes what the caller wrote', async () => {
    const html = (await post('/v1/reports', { plant: { kind: 'expression', expression: '2*exp(-0.5*s)/(s+1)' }, controller: { kind: 'pid', form: 'standard', gain: 0.4, integralTime: 1 }, report: { title: '<b>x</b> & y' } })).body;
    expect(html).toContain('id="figure-step-unavailable"');
    expect(html).toContain('&lt;b&gt;x&lt;/b&gt; &amp; y');
    expect([...html.matchAll(/<svg/g)].length).toBe(2);
  });

  it('refuses a bad body with the catalogue error', async () => {
    const res = await post('/v1/reports', { ...body, report: { profile: 'lenient' } });
    expect(res.statusCode).toBe(400);
    expect(res.json().issues[0].path).toEqual(['report', 'profile']);
  });
});
