/**
 * The review page in a real browser: Debian's chromium driven by
 * playwright-core (never a downloaded browser) loads GET /, runs a
 * bottling-plant demo through the page's own fetch to POST /v1/reports, and
 * checks that the three plots render (laid out, with drawn geometry) and
 * that every figure the report shows equals what POST /v1/analyses returns
 * for the same request. Skipped only on a machine without /usr/bin/chromium
 * outside CI; in CI (CI set) a missing browser fails the run.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import type { FastifyInstance } from 'fastify';
import { chromium, type BrowserContext, type Frame, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../src/http/app.js';
import { BOTTLING_PLANT_LOOPS, PASTEURISER_TEMPERATURE_LOOP } from '../../src/demo/bottling-plant.js';
import { formatFixed } from '../../src/render/format-number.js';

const CHROMIUM = '/usr/bin/chromium';
const skip = !existsSync(CHROMIUM) && !process.env.CI;

describe.skipIf(skip)('review page in chromium', () => {
  let app: FastifyInstance;
  let base: string;
  let context: BrowserContext;
  let page: Page;
  let profile: string;
  const problems: string[] = [];

  beforeAll(async () => {
    app = await buildApp();
    await app.listen({ host: '127.0.0.1', port: 0 });
    base = `http://127.0.0.1:${(app.server.address() as AddressInfo).port}`;
    profile = mkdtempSync(join(tmpdir(), 'loopgate-chromium-'));
    context = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
    page = context.pages()[0] ?? (await context.newPage());
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(`console: ${m.text()}`);
    });
    // The page must not reach anything but this server.
    page.on('request', (r) => {
      const url = r.url();
      if (!url.startsWith(base) && !url.startsWith('about:') && !url.startsWith('blob:') && !url.startsWith('data:')) problems.push(`request to ${url}`);
    });
  });

  afterAll(async () => {
    await context?.close();
    await app?.close();
    if (profile) rmSync(profile, { recursive: true, force: true });
  });

  async function reportFrame(): Promise<Frame> {
    await page.waitForSelector('#status[data-state="ready"]', { timeout: 30_000 });
    const handle = await page.waitForSelector('#report');
    const frame = await handle.contentFrame();
    if (!frame) throw new Error('no report frame');
    await frame.waitForSelector('main.loopgate-report');
    return frame;
  }

  async function analysisOf(request: unknown) {
    const res = await fetch(`${base}/v1/analyses`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(request) });
    expect(res.status).toBe(200);
    return res.json();
  }

  it('offers the bottling-plant demos', async () => {
    await page.goto(`${base}/`);
    const options = await page.$$eval('#demo option', (els) => els.map((e) => (e as HTMLOptionElement).value));
    expect(options).toEqual(BOTTLING_PLANT_LOOPS.map((d) => d.id));
    // The first demo is loaded into the editor as it stands in src/demo.
    expect(JSON.parse(await page.inputValue('#request'))).toEqual(BOTTLING_PLANT_LOOPS[0].request);
  });

  it('runs the pasteuriser demo: the plots render and the figures equal the API\'s', async () => {
    await page.goto(`${base}/`);
    await page.selectOption('#demo', PASTEURISER_TEMPERATURE_LOOP.id);
    await page.click('#load-demo');
    await page.click('#make-report');
    const frame = await reportFrame();
    const a = await analysisOf(PASTEURISER_TEMPERATURE_LOOP.request);

    // Three figures, laid out with a real size, with their curves drawn.
    const plots = await frame.$$eval('svg[data-plot]', (els) =>
      els.map((e) => {
        const box = e.getBoundingClientRect();
        const curves = [...e.querySelectorAll('path.curve[data-series]')].map((p) => (p as SVGPathElement).getTotalLength());
        return { kind: e.getAttribute('data-plot'), width: box.width, height: box.height, curves };
      }),
    );
    expect(plots.map((p) => p.kind)).toEqual(['bode', 'nyquist', 'step']);
    for (const p of plots) {
      expect(p.width).toBeGreaterThan(300);
      expect(p.height).toBeGreaterThan(300);
      expect(p.curves.length).toBeGreaterThan(0);
      for (const length of p.curves) expect(length).toBeGreaterThan(50);
    }

    // Figures shown = the API's numbers, and the text shows them rounded as stated.
    const figures = await frame.$$eval('[data-figure]', (els) =>
      Object.fromEntries(els.map((e) => [e.getAttribute('data-figure'), { value: e.getAttribute('data-value'), text: e.textContent ?? '' }])),
    );
    expect(figures.minGainMarginDb.value).toBe(String(a.margins.gain.db));
    expect(figures.minGainMarginDb.text).toContain(`${formatFixed(a.margins.gain.db, 2)} dB`);
    expect(figures.minPhaseMarginDegrees.value).toBe(String(a.margins.phase.degrees));
    expect(figures.minPhaseMarginDegrees.text).toContain(`${formatFixed(a.margins.phase.degrees, 2)}°`);
    expect(figures.minDelayMarginSeconds.value).toBe(String(a.margins.delay.seconds));
    expect(figures.maxSensitivityPeak.value).toBe(String(a.peaks.sensitivity.value));
    expect(figures.maxSensitivityPeak.text).toContain(formatFixed(a.peaks.sensitivity.value, 3));
    expect(figures.maxComplementaryPeak.value).toBe(String(a.peaks.complementarySensitivity.value));
    expect(figures.crossoverFrequency.value).toBe(String(a.bandwidth.crossover));
    expect(figures.closedLoopBandwidth.value).toBe(String(a.bandwidth.closedLoop));
    expect(await frame.textContent('[data-field="requestHash"]')).toBe(a.requestHash);

    // The margins labelled on the Bode figure are the API's too.
    const gmLabel = await frame.textContent('svg[data-plot="bode"] text[data-mark="gain-margin"]');
    expect(gmLabel).toContain(`GM ${formatFixed(a.margins.gain.db, 1)} dB`);

    // The time-response figures equal those of the analysis asked for them.
    const timed = await analysisOf({ ...PASTEURISER_TEMPERATURE_LOOP.request, timeResponse: {} });
    expect(figures.overshootPercent.value).toBe(String(timed.timeResponse.setpoint.overshootPercent));
    expect(figures.settlingTime.value).toBe(String(timed.timeResponse.setpoint.settlingTime));
    expect(figures.peakDeviation.value).toBe(String(timed.timeResponse.loadDisturbance.peakDeviation));
    expect(problems).toEqual([]);
  });

  it('shows the API\'s error for a request it refuses, and a parse error for text that is not JSON', async () => {
    await page.goto(`${base}/`);
    await page.fill('#request', JSON.stringify({ plant: { kind: 'transfer-function', numerator: [1], denominator: [0, 0] } }));
    await page.click('#make-report');
    await page.waitForSelector('#status[data-state="error"]');
    expect(await page.textContent('#error')).toContain('422 zero_denominator');
    expect(await page.textContent('#error')).toContain('plant.denominator');
    await page.fill('#request', '{"plant": ');
    await page.click('#make-report');
    await page.waitForFunction(() => document.querySelector('#status')?.textContent === 'The request is not valid JSON.');
    expect(problems.filter((p) => !p.includes('422'))).toEqual([]);
  });
});
