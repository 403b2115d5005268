/**
 * Sampled loops through analyze(body), the same answer as POST /v1/analyses:
 *  - the continuous figures are unchanged by adding controller.implementation;
 *  - a loop whose continuous design is stable for every gain but whose
 *    sampled version is unstable: P control of a held first-order lag,
 *    unstable when kp > (1 + a)/(K(1 − a)), a = e^{−Ts/τ} (derivation,
 *    Åström & Wittenmark, Computer-Controlled Systems, §3.2);
 *  - actuator noise (q/√12)·‖C·S‖₂ against the closed form
 *    ‖C·S‖₂² = kp²(1 + (kp·b)²/(1 − p²)), p = a − kp·b (derivation);
 *  - a plant given in z (both coefficient orders, and zeros-poles) gives the
 *    same sampled figures as its continuous original held and sampled;
 *  - the phase lost at crossover against ωc·(Ts/2 + d) for P control, where
 *    the controller adds no phase of its own (hold lag ωTs/2: derivation);
 *  - plants without a rational model (an expression, measured data) as
 *    C(e^{jωTs})·H(jω)·P(jω), aliasing neglected: close to the exact
 *    sampled loop when |P| is small above π/Ts, the error shrinking with Ts.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';
import { AnalysisResponseSchema } from '../../src/contract/schemas/analysis-response.js';

const K = 2;
const TAU = 0.5;
const TS = 0.25;
const A = Math.exp(-TS / TAU);
const B = K * (1 - A);
const LIMIT = (1 + A) / (K * (1 - A));
const lag = { kind: 'transfer-function', numerator: [K], denominator: [TAU, 1] } as const;
const p = (kp: number, extra: Record<string, unknown> = {}) => ({ kind: 'pid', form: 'parallel', kp, implementation: { samplePeriod: TS, method: 'tustin' }, ...extra });

describe('analyze with controller.implementation', () => {
  it('keeps the continuous figures as they were and adds a schema-valid sampled block', () => {
    const controller = { kind: 'pid', form: 'standard', gain: 2, integralTime: 5, derivativeTime: 1, derivativeFilter: { n: 10 } };
    const plant = { kind: 'transfer-function', numerator: [144], denominator: [1, 7.2, 144] };
    const plain = analyze({ plant, controller });
    const sampled = analyze({ plant, controller: { ...controller, implementation: { samplePeriod: 0.01, method: 'backward-euler', computationDelay: 0.01 } } });
    for (const key of ['stability', 'margins', 'peaks', 'bandwidth', 'grid', 'response'] as const) expect(sampled[key]).toEqual(plain[key]);
    expect(sampled.warnings.slice(0, plain.warnings.length)).toEqual(plain.warnings);
    expect(plain.sampled).toBeUndefined();
    expect(sampled.sampled).toBeDefined();
    expect(() => AnalysisResponseSchema.parse(sampled)).not.toThrow();
    expect(sampled.sampled!.response!.frequency.at(-1)).toBeCloseTo(Math.PI / 0.01, 9);
  });

  it('flags a sampled loop that is unstable while the continuous design is stable', () => {
    const stable = analyze({ plant: lag, controller: p(LIMIT * 0.99), detail: 'summary' });
    const unstable = analyze({ plant: lag, controller: p(LIMIT * 1.01), detail: 'summary' });
    expect(stable.stability.closedLoopStable).toBe(true);
    expect(stable.sampled!.stability.closedLoopStable).toBe(true);
    expect(unstable.stability.closedLoopStable).toBe(true);
    expect(unstable.margins.gain).toBeNull();
    expect(unstable.sampled!.stability.closedLoopStable).toBe(false);
    expect(unstable.sampled!.stability.closedLoopPoles![0].re).toBeCloseTo(A - LIMIT * 1.01 * B, 12);
    expect(unstable.sampled!.margins.gain!.ratio).toBeCloseTo(1 / 1.01, 12);
    expect(unstable.sampled!.margins.gain!.frequency).toBe(Math.PI / TS);
    const codes = unstable.warnings.map((w) => w.code);
    expect(codes).toContain('sampled_closed_loop_unstable');
    expect(codes).not.toContain('closed_loop_unstable');
  });

  it('reports the actuator noise (q/√12)·‖C·S‖₂ and warns above actuatorNoiseLimit', () => {
    const kp = 1.5;
    const q = 0.01;
    const pole = A - kp * B;
    const gain = Math.sqrt(kp * kp * (1 + (kp * B) ** 2 / (1 - pole * pole)));
    const r = analyze({ plant: lag, controller: p(kp), measurementNoise: { quantisationStep: q }, detail: 'summary' });
    const n = r.sampled!.noise!;
    expect(n.measurementNoiseRms).toBeCloseTo(q / Math.sqrt(12), 15);
    expect(n.noiseGain!).toBeCloseTo(gain, 10);
    expect(n.actuatorNoiseRms!).toBeCloseTo((q / Math.sqrt(12)) * gain, 12);
    expect(r.warnings.map((w) => w.code)).not.toContain('actuator_noise_high');
    const limited = analyze({ plant: lag, controller: p(kp), measurementNoise: { quantisationStep: q, actuatorNoiseLimit: 0.5 * n.actuatorNoiseRms! }, detail: 'summary' });
    expect(limited.warnings.find((w) => w.code === 'actuator_noise_high')!.value).toBeCloseTo(n.actuatorNoiseRms!, 12);
    // An unstable sampled loop has no noise figure.
    const bad = analyze({ plant: lag, controller: p(LIMIT * 1.2), measurementNoise: { quantisationStep: q }, detail: 'summary' });
    expect(bad.sampled!.noise!.noiseGain).toBeNull();
  });

  it('gives the phase lost at the continuous crossover ≈ ωc·(Ts/2 + d) for P control', () => {
    const ts = 0.01;
    const r = analyze({ plant: lag, controller: { kind: 'pid', form: 'parallel', kp: 3, implementation: { samplePeriod: ts, method: 'tustin', computationDelay: ts } }, detail: 'summary' });
    const c = r.sampled!.continuousDesign!;
    const wc = Math.sqrt((K * 3) ** 2 - 1) / TAU;
    expect(c.crossoverFrequency).toBeCloseTo(wc, 10);
    expect(c.holdAndDelayEstimateDegrees).toBeCloseTo(wc * 1.5 * ts * (180 / Math.PI), 10);
    expect(Math.abs(c.phaseLostAtCrossoverDegrees! / c.holdAndDelayEstimateDegrees! - 1)).toBeLessThan(0.01);
    expect(c.phaseMarginChangeDegrees).toBeCloseTo(c.sampledPhaseMarginDegrees! - c.continuousPhaseMarginDegrees!, 12);
    expect(c.phaseMarginChangeDegrees!).toBeLessThan(0);
  });
});

describe('sampling warnings', () => {
  it('sample_rate_low when 2π/Ts is under ten times the closed-loop bandwidth', () => {
    const r = analyze({ plant: lag, controller: p(1.5), detail: 'summary' });
    const w = r.warnings.find((x) => x.code === 'sample_rate_low')!;
    expect(w.value).toBeCloseTo((2 * Math.PI) / TS / r.bandwidth.closedLoop!, 10);
    expect(w.value!).toBeLessThan(10);
    const fast = analyze({ plant: lag, controller: { ...p(1.5), implementation: { samplePeriod: 0.005, method: 'tustin' } }, detail: 'summary' });
    expect(fast.warnings.map((x) => x.code)).not.toContain('sample_rate_low');
    expect(fast.sampled!.sampleRate.samplesPerBandwidth!).toBeGreaterThan(10);
  });

  it('controller_gain_high_at_nyquist: backward Euler of an unfiltered derivative has kp + 2kd/Ts there; Tustin an infinite gain', () => {
    const pd = (method: string) => ({ kind: 'pid', form: 'parallel', kp: 1, kd: 0.1, implementation: { samplePeriod: 0.005, method } });
    const be = analyze({ plant: lag, controller: pd('backward-euler'), detail: 'summary' });
    expect(be.sampled!.controller!.gainAtNyquistFrequency.ratio).toBeCloseTo(1 + (2 * 0.1) / 0.005, 9);
    expect(be.warnings.find((w) => w.code === 'controller_gain_high_at_nyquist')!.value).toBeCloseTo(41, 9);
    expect(be.warnings.map((w) => w.code)).toContain('derivative_unfiltered');
    const tu = analyze({ plant: lag, controller: pd('tustin'), detail: 'summary' });
    expect(tu.sampled!.controller!.gainAtNyquistFrequency.ratio).toBeNull();
    expect(tu.warnings.find((w) => w.code === 'controller_gain_high_at_nyquist')!.value).toBeNull();
    // A filtered derivative with N = 10 stays below 21·kp.
    const filtered = analyze({ plant: lag, controller: { ...pd('tustin'), derivativeFilter: { n: 10 } }, detail: 'summary' });
    expect(filtered.sampled!.controller!.gainAtNyquistFrequency.relativeToProportional!).toBeLessThan(11 + 1e-9);
    expect(filtered.warnings.map((w) => w.code)).not.toContain('controller_gain_high_at_nyquist');
  });

  it('discretised_controller_unstable for forward Euler with Ts > 2·Tf', () => {
    const c = { kind: 'pid', form: 'parallel', kp: 1, kd: 0.1, derivativeFilter: { timeConstant: 0.05 }, implementation: { samplePeriod: 0.2, method: 'forward-euler' } };
    const r = analyze({ plant: lag, controller: c, detail: 'summary' });
    expect(r.sampled!.controller!.unstablePoles).toBe(1);
    expect(r.warnings.map((w) => w.code)).toContain('discretised_controller_unstable');
  });
});

describe('plants given in z', () => {
  const held = analyze({ plant: lag, controller: p(1.5), detail: 'summary' });
  const controller = p(1.5);
  const cases: [string, Record<string, unknown>][] = [
    ['descending powers of z', { kind: 'transfer-function', variable: 'z', samplePeriod: TS, numerator: [B], denominator: [1, -A] }],
    ['ascending powers of z⁻¹', { kind: 'transfer-function', variable: 'z', samplePeriod: TS, coefficientOrder: 'ascending-powers-of-inverse-z', numerator: [0, B], denominator: [1, -A] }],
    ['zeros and poles in z', { kind: 'zeros-poles', variable: 'z', samplePeriod: TS, zeros: [], poles: [A], gain: B }],
  ];
  for (const [name, plant] of cases) {
    it(`${name}: the same sampled figures as the held continuous lag, now at the top level`, () => {
      const r = analyze({ plant, controller, detail: 'summary' });
      expect(() => AnalysisResponseSchema.parse(r)).not.toThrow();
      expect(r.sampled!.plant).toBe('given-in-z');
      expect(r.sampled!.continuousDesign).toBeNull();
      expect(r.margins.gain!.ratio).toBeCloseTo(held.sampled!.margins.gain!.ratio, 11);
      expect(r.margins.phase!.degrees).toBeCloseTo(held.sampled!.margins.phase!.degrees, 9);
      expect(r.peaks.sensitivity.value).toBeCloseTo(held.sampled!.peaks.sensitivity.value, 9);
      expect(r.stability.closedLoopStable).toBe(true);
      expect(r.sampled!.stability.closedLoopPoles![0].re).toBeCloseTo(A - 1.5 * B, 12);
    });
  }

  it('a loop given in z without a controller; a whole-sample delay as z^(−d)', () => {
    const r = analyze({ plant: { kind: 'transfer-function', variable: 'z', samplePeriod: TS, numerator: [1.5 * B], denominator: [1, -A], delay: 2 * TS }, detail: 'summary' });
    expect(r.sampled!.plantModel!.delaySamples).toBe(2);
    // Closed loop z³ − a z² + 1.5b: the roots decide.
    const mags = r.sampled!.stability.closedLoopPoles!.map((q) => Math.hypot(q.re, q.im));
    expect(mags).toHaveLength(3);
    expect(r.stability.closedLoopStable).toBe(mags.every((m) => m < 1));
  });
});

describe('plants without a rational model: the hold response, aliasing neglected', () => {
  const controller = (ts: number) => ({ kind: 'pid', form: 'parallel', kp: 1.5, ki: 2, implementation: { samplePeriod: ts, method: 'tustin', computationDelay: ts } });
  // The pump's lag, two poles: little gain above π/Ts for the sample periods below.
  const rational = { kind: 'transfer-function', numerator: [144], denominator: [1, 7.2, 144] };
  const expression = { kind: 'expression', expression: '144/(s^2 + 7.2*s + 144)' };
  const measured = (ts: number) => {
    const frequency = Array.from({ length: 400 }, (_, i) => 0.01 * Math.pow(10, (i / 399) * Math.log10((Math.PI / ts) * 2 / 0.01)));
    const value = frequency.map((w) => {
      const dr = 144 - w * w;
      const di = 7.2 * w;
      const d = dr * dr + di * di;
      return { re: (144 * dr) / d, im: (-144 * di) / d };
    });
    return { kind: 'frequency-response', frequency, real: value.map((v) => v.re), imag: value.map((v) => v.im) };
  };

  it('warns when measured data end below the Nyquist frequency', () => {
    const data = measured(0.02);
    const short = { ...data, frequency: data.frequency.slice(0, 300), real: data.real.slice(0, 300), imag: data.imag.slice(0, 300) };
    const r = analyze({ plant: short, controller: controller(0.005), detail: 'summary' });
    const w = r.warnings.find((x) => x.code === 'sampled_unit_circle_sweep_approximate')!;
    expect(w).toBeDefined();
    expect(r.sampled!.grid.max).toBeCloseTo(short.frequency.at(-1)!, 9);
    expect(r.sampled!.grid.max).toBeLessThan(Math.PI / 0.005);
  });

  for (const ts of [0.02, 0.005]) {
    it(`Ts = ${ts}: an expression and measured data come close to the exactly sampled loop`, () => {
      const exact = analyze({ plant: rational, controller: controller(ts), detail: 'summary' }).sampled!;
      for (const plant of [expression, measured(ts)]) {
        const r = analyze({ plant, controller: controller(ts), detail: 'summary' });
        expect(() => AnalysisResponseSchema.parse(r)).not.toThrow();
        const s = r.sampled!;
        expect(s.plant).toBe('hold-response-without-aliasing');
        expect(s.plantModel).toBeNull();
        expect(s.stability.method).toBe('unit-circle-nyquist');
        expect(s.stability.closedLoopStable).toBe(exact.stability.closedLoopStable);
        expect(s.notes.join(' ')).toMatch(/neglecting aliasing/);
        // The expression differs by aliasing alone (|P| at π/Ts is about 144/(π/Ts)², 0.6 % and 0.04 %), falling
        // fast with Ts; measured data adds the error of linear interpolation between 400 points.
        const [degrees, relative] = plant.kind === 'expression' ? (ts === 0.02 ? [0.01, 1e-4] : [1e-4, 1e-6]) : [0.05, 1e-4];
        expect(Math.abs(s.margins.phase!.degrees - exact.margins.phase!.degrees)).toBeLessThan(degrees);
        expect(Math.abs(s.margins.phase!.frequency / exact.margins.phase!.frequency - 1)).toBeLessThan(relative);
      }
    });
  }
});
