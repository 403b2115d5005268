/**
 * Measured plants: data sampled from an exact model must give the exact
 * model's margins to within the interpolation error the answer reports.
 * The exact figures come from the independent mpmath fixture
 * (scripts/fixtures/make_loop_reference.py → fixtures/reference/loops.json);
 * the data are the fixture's plants sampled at 20, 35 and 50 points per decade.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';
import { plantModel } from '../../src/model/plant-model.js';
import type { PlantDescription } from '../../src/model/plant-description.js';

interface FixtureLoop {
  name: string;
  body: { plant: PlantDescription & { delay?: number }; controller?: unknown };
  expected: {
    gain: { ratio: number; db: number; frequency: number } | null;
    phase: { degrees: number; frequency: number } | null;
    sensitivityPeak: { value: number; frequency: number };
    closedLoopStable: boolean;
    openLoopUnstablePoles: number;
    integrators: number;
  };
}

const fixture = JSON.parse(readFileSync('fixtures/reference/loops.json', 'utf8')) as { loops: FixtureLoop[] };

/** Sample the plant over [lo, hi] at `perDecade` points per decade, as a measured real/imag table. */
function sampled(plant: PlantDescription, lo: number, hi: number, perDecade: number) {
  const model = plantModel(plant);
  const n = Math.ceil(Math.log10(hi / lo) * perDecade) + 1;
  const frequency: number[] = [];
  const real: number[] = [];
  const imag: number[] = [];
  for (let k = 0; k < n; k++) {
    const w = lo * Math.pow(hi / lo, k / (n - 1));
    const v = model.evaluate(w, { re: 0, im: 0 });
    frequency.push(w);
    real.push(v.re);
    imag.push(v.im);
  }
  return { frequency, real, imag };
}

/** Loops where a measured sweep can cover what matters: no plant integrators (the data cannot show them) and a band the delay lets us sample. */
const cases = fixture.loops.filter((l) => l.body.plant.kind !== 'expression' && l.expected.integrators === (l.body.controller && (l.body.controller as { ki?: number; integralTime?: number }).ki !== 0 ? 1 : 0) && l.expected.phase);

/** The band to sample: two decades below to 30× above what matters, capped where the delay's phase steps pass 60°. */
function sweepBand(loop: FixtureLoop, perDecade: number): { lo: number; hi: number } | null {
  const e = loop.expected;
  const critical = [e.phase!.frequency, e.sensitivityPeak.frequency, ...(e.gain && e.gain.frequency > 0 ? [e.gain.frequency] : [])];
  const lo = Math.min(...critical) / 100;
  let hi = Math.max(...critical) * 30;
  const delay = loop.body.plant.delay ?? 0;
  const step = Math.pow(10, 1 / perDecade) - 1;
  if (delay > 0) hi = Math.min(hi, Math.PI / 3 / (delay * step));
  return hi >= Math.max(...critical) * 3 ? { lo, hi } : null;
}

const warned = new Set<string>();

describe.each([20, 35, 50])('measured data at %i points per decade', (perDecade) => {
  const covered = cases.filter((l) => sweepBand(l, perDecade) !== null);
  it('covers most of the reference loops', () => {
    expect(covered.length).toBeGreaterThanOrEqual(20);
  });
  it.each(covered.map((l) => [l.name, l] as const))('%s: margins within the reported interpolation error, or a resolution warning', (_name, loop) => {
    const e = loop.expected;
    const { lo, hi } = sweepBand(loop, perDecade)!;
    const data = sampled(loop.body.plant, lo, hi, perDecade);
    const r = analyze({
      plant: { kind: 'frequency-response', ...data, openLoopUnstablePoles: e.openLoopUnstablePoles },
      ...(loop.body.controller ? { controller: loop.body.controller } : {}),
      detail: 'summary',
    });
    expect(r.stability.closedLoopStable).toBe(e.closedLoopStable);
    // Where the data is too coarse for a resonance, the answer must say so; the error promise then does not hold.
    if (r.warnings.some((w) => w.code === 'sparse_data_near_crossover')) {
      warned.add(`${perDecade}:${loop.name}`);
      return;
    }
    const pm = r.margins.phase!;
    const pmError = pm.interpolationError!.degrees!;
    expect(Math.abs(pm.degrees - e.phase!.degrees)).toBeLessThanOrEqual(3 * pmError + 1e-9);
    if (e.gain && e.gain.frequency > 0 && r.margins.gain && r.margins.gain.frequency > 0) {
      const gmError = r.margins.gain.interpolationError!.db!;
      expect(Math.abs(r.margins.gain.db - e.gain.db)).toBeLessThanOrEqual(3 * gmError + 1e-9);
    }
    expect(Math.abs(r.peaks.sensitivity.value - e.sensitivityPeak.value)).toBeLessThanOrEqual(3 * r.measurement!.interpolationError.sensitivityPeak + 1e-9);
    // Without a resolution warning the interpolation error is small.
    expect(pmError).toBeLessThan(0.5);
  });
});

it('only loops with a lightly damped pair get a resolution warning, and fewer of them as the density grows', () => {
  const resonant = (k: string) => /lightly-damped|complex-rhp-pair/.test(k);
  expect([...warned].filter((k) => !resonant(k))).toEqual([]);
  const at = (d: number) => [...warned].filter((k) => k.startsWith(`${d}:`)).length;
  expect(at(50)).toBeLessThan(at(20));
});

describe('measured plants: input forms, verdicts and refusals', () => {
  const plant = { kind: 'transfer-function' as const, numerator: [2], denominator: [10, 11, 1], delay: 0.3 };
  const controller = { kind: 'pid', form: 'standard', gain: 1.5, integralTime: 6 };
  const data = sampled(plant, 0.01, 100, 30);
  const mag = data.real.map((re, i) => Math.hypot(re, data.imag[i]));
  const phase = data.real.map((re, i) => (Math.atan2(data.imag[i], re) * 180) / Math.PI);

  it('CSV and JSON arrays of the same data give identical answers', () => {
    const csv = 'frequency,magnitude,phase\n' + data.frequency.map((w, i) => `${w},${mag[i]},${phase[i]}`).join('\n');
    const a = analyze({ plant: { kind: 'frequency-response', csv, openLoopUnstablePoles: 0 }, controller, detail: 'summary' });
    const b = analyze({ plant: { kind: 'frequency-response', frequency: data.frequency, magnitude: mag, phase, openLoopUnstablePoles: 0 }, controller, detail: 'summary' });
    const strip = (x: typeof a) => ({ ...x, requestHash: '' });
    expect(strip(a)).toEqual(strip(b));
  });

  it('Hz, dB and radian units give the same answer as rad/s, absolute and degrees', () => {
    const a = analyze({ plant: { kind: 'frequency-response', frequency: data.frequency, magnitude: mag, phase, openLoopUnstablePoles: 0 }, controller, detail: 'summary' });
    const b = analyze({
      plant: {
        kind: 'frequency-response',
        frequency: data.frequency.map((w) => w / (2 * Math.PI)),
        frequencyUnit: 'Hz',
        magnitude: mag.map((m) => 20 * Math.log10(m)),
        magnitudeUnit: 'dB',
        phase: phase.map((p) => (p * Math.PI) / 180),
        phaseUnit: 'rad',
        openLoopUnstablePoles: 0,
      },
      controller,
      detail: 'summary',
    });
    expect(b.margins.phase!.degrees).toBeCloseTo(a.margins.phase!.degrees, 9);
    expect(b.margins.gain!.db).toBeCloseTo(a.margins.gain!.db, 9);
  });

  it('warns that the open-loop pole count was assumed when it is not given', () => {
    const r = analyze({ plant: { kind: 'frequency-response', ...data }, controller, detail: 'summary' });
    expect(r.warnings.map((w) => w.code)).toContain('open_loop_poles_assumed');
    expect(r.stability.openLoopUnstablePolesAssumed).toBe(true);
  });

  it('an open-loop unstable plant given as data gets the Nyquist verdict of its pole count', () => {
    // 1/(s − 1) under P control kp: stable iff kp > 1 (closed-loop pole at 1 − kp; closed form).
    const unstable = sampled({ kind: 'transfer-function', numerator: [1], denominator: [1, -1] }, 0.001, 1000, 30);
    const verdict = (kp: number) =>
      analyze({ plant: { kind: 'frequency-response', ...unstable, openLoopUnstablePoles: 1 }, controller: { kind: 'pid', form: 'parallel', kp }, detail: 'summary' }).stability;
    expect(verdict(2).closedLoopStable).toBe(true);
    expect(verdict(0.5).closedLoopStable).toBe(false);
    expect(verdict(0.5).nyquist.closedLoopUnstablePoles).toBe(1);
  });

  it('refuses unsorted and duplicated frequencies with 422 and the index', () => {
    const f = [...data.frequency];
    [f[3], f[4]] = [f[4], f[3]];
    expect(() => analyze({ plant: { kind: 'frequency-response', frequency: f, magnitude: mag, phase } })).toThrow(expect.objectContaining({ statusCode: 422, code: 'measured_frequency_unsorted' }));
    const g = [...data.frequency];
    g[5] = g[4];
    expect(() => analyze({ plant: { kind: 'frequency-response', frequency: g, magnitude: mag, phase } })).toThrow(expect.objectContaining({ statusCode: 422, code: 'measured_frequency_duplicated', issues: [expect.objectContaining({ path: ['plant', 'frequency', 5] })] }));
  });

  it('refuses a CSV cell that is not a number, naming the row', () => {
    const csv = 'frequency,magnitude,phase\n0.1,1,-10\n0.2,abc,-20\n0.3,0.9,-30\n0.4,0.8,-40';
    expect(() => analyze({ plant: { kind: 'frequency-response', csv } })).toThrow(/row 3/);
  });

  it('the coherence band follows first-order propagation of the Bendat & Piersol random error', () => {
    // Perturb the data by the random error itself (magnitude by ε, phase by σφ ≈ ε rad) and
    // re-analyse: two standard deviations of PM must equal 2·hypot(ΔPM_phase, ΔPM_magnitude).
    const gamma2 = 0.9;
    const nd = 16;
    const eps = Math.sqrt(1 - gamma2) / (Math.sqrt(gamma2) * Math.sqrt(2 * nd));
    const base = { kind: 'frequency-response' as const, frequency: data.frequency, openLoopUnstablePoles: 0 };
    const pmOf = (m: number[], p: number[]) => analyze({ plant: { ...base, magnitude: m, phase: p }, controller, detail: 'summary' }).margins.phase!.degrees;
    const pm0 = pmOf(mag, phase);
    const dPhase = pmOf(mag, phase.map((p) => p + (eps * 180) / Math.PI)) - pm0;
    const dMag = pmOf(mag.map((m) => m * (1 + eps)), phase) - pm0;
    const r = analyze({ plant: { ...base, magnitude: mag, phase, coherence: data.frequency.map(() => gamma2), averages: nd }, controller, detail: 'summary' });
    expect(r.margins.phase!.uncertainty!.degrees!).toBeCloseTo(2 * Math.hypot(dPhase, dMag), 2);
    expect(r.measurement!.uncertainty!.standardDeviations).toBe(2);
  });
});
