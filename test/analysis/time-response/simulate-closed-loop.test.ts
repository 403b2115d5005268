import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { simulateClosedLoop, TimeResponseInputError } from '../../../src/analysis/time-response/index.js';

const relative = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/** Bisection on a closed-form expression (test-side helper, independent of the module). */
function bisect(fn: (t: number) => number, lo: number, hi: number): number {
  let flo = fn(lo);
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = fn(mid);
    if (fm > 0 === flo > 0) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('simulateClosedLoop: second-order loop L = ωn²/(s(s + 2ζωn))', () => {
  const wn = 2;
  for (const zeta of [0.1, 0.3, 0.5, 0.7, 0.9]) {
    it(`matches the closed-form step figures for ζ = ${zeta}`, () => {
      const r = simulateClosedLoop({
        plant: { numerator: [wn * wn], denominator: [1, 2 * zeta * wn, 0], delay: 0 },
        controller: { numerator: [1], denominator: [1] },
      });
      const s = r.setpointStep;
      const root = Math.sqrt(1 - zeta * zeta);
      // Ogata, Modern Control Engineering, 5th ed., §5-3: Mp = exp(−ζπ/√(1−ζ²)), tp = π/(ωn√(1−ζ²)).
      expect(relative(s.overshootPercent!, 100 * Math.exp((-Math.PI * zeta) / root))).toBeLessThan(1e-9);
      expect(relative(s.peakTime!, Math.PI / (wn * root))).toBeLessThan(1e-9);
      // Closed-form unit-step response (Ogata §5-3):
      // y = 1 − e^{−ζωn t}(cos ωd t + ζ/√(1−ζ²) sin ωd t), ωd = ωn√(1−ζ²); crossings by bisection on it.
      const wd = wn * root;
      const y = (t: number): number => 1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + (zeta / root) * Math.sin(wd * t));
      const tp = Math.PI / wd;
      const t10 = bisect((t) => y(t) - 0.1, 0, tp);
      const t90 = bisect((t) => y(t) - 0.9, 0, tp);
      expect(relative(s.riseTime!, t90 - t10)).toBeLessThan(1e-9);
      // Settling: the last time |y − 1| = 0.02; the envelope e^{−ζωn t}/√(1−ζ²) bounds where to look.
      const envelopeEnd = Math.log(1 / (0.02 * root)) / (zeta * wn);
      let last = 0;
      const n = 200000;
      for (let i = 0; i <= n; i++) {
        const t = (envelopeEnd * i) / n;
        if (Math.abs(y(t) - 1) > 0.02) last = t;
      }
      const ts = bisect((t) => Math.abs(y(t) - 1) - 0.02, last, last + envelopeEnd / n);
      expect(relative(s.settlingTime!, ts)).toBeLessThan(1e-9);
      // Integrating loop: T(0) = 1 exactly (final-value theorem, common practice).
      expect(s.finalValue).toBe(1);
      expect(s.steadyStateError).toBe(0);
      expect(r.stable).toBe(true);
    });
  }
});

describe('simulateClosedLoop: P control of a type-0 plant K/(τs + 1)', () => {
  const K = 2.5;
  const tau = 0.8;
  const kp = 1.6;
  it('has steady-state error 1/(1 + K·kp) and the first-order closed-loop figures', () => {
    const r = simulateClosedLoop({
      plant: { numerator: [K], denominator: [tau, 1], delay: 0 },
      controller: { numerator: [kp], denominator: [1] },
    });
    const s = r.setpointStep;
    // Final-value theorem (common practice): e∞ = 1/(1 + K·P(0)).
    expect(relative(s.steadyStateError!, 1 / (1 + K * kp))).toBeLessThan(1e-14);
    // Closed loop a/(τcl s + 1) with τcl = τ/(1 + K kp): y = a(1 − e^{−t/τcl}) (derivation):
    // rise time τcl·ln 9, 2 % settling time τcl·ln 50, no overshoot.
    const tcl = tau / (1 + K * kp);
    expect(relative(s.riseTime!, tcl * Math.log(9))).toBeLessThan(1e-10);
    expect(relative(s.settlingTime!, tcl * Math.log(50))).toBeLessThan(1e-10);
    expect(s.overshootPercent).toBe(0);
    expect(s.peakTime).toBeNull();
    const a = (K * kp) / (1 + K * kp);
    r.time.forEach((t, i) => expect(Math.abs(s.output[i] - a * (1 - Math.exp(-t / tcl)))).toBeLessThan(1e-13));
    // u = kp(1 − y): u(0) = kp (the step passes straight through the gain).
    expect(s.control[0]).toBeCloseTo(kp, 14);
  });

  it('keeps the same steady-state error with a delay (e^{−s·0} = 1)', () => {
    const r = simulateClosedLoop({
      plant: { numerator: [K], denominator: [tau, 1], delay: 0.1 },
      controller: { numerator: [kp], denominator: [1] },
    });
    expect(r.stable).toBe(true);
    expect(relative(r.setpointStep.steadyStateError!, 1 / (1 + K * kp))).toBeLessThan(1e-14);
    expect(Math.abs(r.setpointStep.output[r.time.length - 1] - K * kp / (1 + K * kp))).toBeLessThan(1e-6);
  });
});

describe('simulateClosedLoop: delayed first-order lag under P control, closed form by the method of steps', () => {
  // Derivation (method of steps, zero history), P = K e^{−sT}/(τs + 1), C = kp, r = 1, a = K·kp:
  //   [0, T):   w = u(t − T) = 0                       ⇒ y = 0, u = kp.
  //   [T, 2T):  w = kp, τy' + y = a                     ⇒ y = a(1 − e^{−(t−T)/τ}), u = kp(1 − y).
  //   [2T, 3T): w = kp(1 − a(1 − e^{−σ/τ})), σ = t − 2T ⇒ τy' + y = a(1 − a) + a² e^{−σ/τ},
  //             y = a(1 − a) + (y(2T) − a(1 − a)) e^{−σ/τ} + a²(σ/τ) e^{−σ/τ}
  //             (the forcing e^{−σ/τ} is resonant with the lag: particular solution (c/τ)σe^{−σ/τ}).
  const K = 2;
  const tau = 1.5;
  const T = 0.7;
  const kp = 0.8;
  const a = K * kp;
  const exact = (t: number): number => {
    if (t < T) return 0;
    if (t < 2 * T) return a * (1 - Math.exp(-(t - T) / tau));
    const s = t - 2 * T;
    const y0 = a * (1 - Math.exp(-T / tau));
    return a * (1 - a) + (y0 - a * (1 - a)) * Math.exp(-s / tau) + a * a * (s / tau) * Math.exp(-s / tau);
  };
  it('agrees to 1e-11 on the first three delay intervals', () => {
    const duration = 3 * T * 0.999;
    const r = simulateClosedLoop({
      plant: { numerator: [K], denominator: [tau, 1], delay: T },
      controller: { numerator: [kp], denominator: [1] },
      duration,
      points: 601,
    });
    let worst = 0;
    r.time.forEach((t, i) => (worst = Math.max(worst, Math.abs(r.setpointStep.output[i] - exact(t)))));
    expect(worst).toBeLessThan(1e-11);
    // At t = T the delayed step arrives: y is continuous (0) but u still equals kp.
    expect(r.setpointStep.control[0]).toBe(kp);
  });
});

describe('simulateClosedLoop: P control of K e^{−sT}/(τs + 1) against the series solution', () => {
  // Derivation: Y/R = L/(1 + L) = Σ_{n≥1} (−1)^{n−1} Lⁿ with L = a e^{−sT}/(τs + 1), a = K kp, and
  // Lⁿ/s = aⁿ e^{−nsT}/((τs + 1)ⁿ s) is the delayed step response of n cascaded lags (Erlang):
  //   y(t) = Σ_{n≥1} (−1)^{n−1} aⁿ P(n, (t − nT)/τ) for t > nT,  P(n, x) = 1 − e^{−x} Σ_{k<n} x^k/k!.
  // Only n up to a few times t/τ contribute, so the series is exact for any delay, short or long.
  const K = 1;
  const tau = 1;
  const kp = 0.8;
  const a = K * kp;
  const series = (t: number, T: number): number => {
    let y = 0;
    for (let n = 1; n * T < t && n < 400; n++) {
      const x = (t - n * T) / tau;
      let term = 1;
      let partial = 0;
      for (let k = 0; k < n; k++) {
        partial += term;
        term *= x / (k + 1);
      }
      y += (n % 2 === 1 ? 1 : -1) * a ** n * (1 - Math.exp(-x) * partial);
    }
    return y;
  };
  for (const T of [0.3, 1e-6]) {
    it(`agrees with the series for T = ${T} over the whole horizon`, () => {
      const r = simulateClosedLoop({
        plant: { numerator: [K], denominator: [tau, 1], delay: T },
        controller: { numerator: [kp], denominator: [1] },
      });
      expect(r.stable).toBe(true);
      let worst = 0;
      r.time.forEach((t, i) => {
        if (i % 20 === 0) worst = Math.max(worst, Math.abs(r.setpointStep.output[i] - series(t, T)));
      });
      expect(worst).toBeLessThan(1e-10);
      expect(relative(r.setpointStep.steadyStateError!, 1 / (1 + a))).toBeLessThan(1e-14);
    });
  }
});

interface FixtureSide {
  finalValue: number;
  output: number[];
  control: number[];
  overshootPercent?: number;
  peakTime?: number;
  time10?: number;
  time90?: number;
  settlingTime?: number;
  ie?: number;
  iae?: number;
}
interface FixtureCase {
  name: string;
  plant: { numerator: number[]; denominator: number[]; delay: number };
  controller: { numerator: number[]; denominator: number[] };
  duration: number;
  points: number;
  time: number[];
  setpoint: FixtureSide;
  disturbance: FixtureSide;
}

describe('simulateClosedLoop: delayed loops against scipy (method of steps with solve_ivp DOP853)', () => {
  // fixtures/time-response/delayed-loops.json from scripts/fixtures/make_time_response_reference.py
  const fixture = JSON.parse(readFileSync(new URL('../../../fixtures/time-response/delayed-loops.json', import.meta.url), 'utf8')) as {
    cases: FixtureCase[];
  };
  for (const c of fixture.cases) {
    it(c.name, () => {
      const r = simulateClosedLoop({ plant: c.plant, controller: c.controller, duration: c.duration, points: c.points });
      expect(r.stable).toBe(true);
      r.time.forEach((t, i) => expect(t).toBeCloseTo(c.time[i], 12));
      const scale = (v: number[]): number => Math.max(...v.map(Math.abs));
      const worst = (a: number[], b: number[]): number => Math.max(...a.map((v, i) => Math.abs(v - b[i]))) / scale(b);
      expect(worst(r.setpointStep.output, c.setpoint.output)).toBeLessThan(1e-9);
      expect(worst(r.setpointStep.control, c.setpoint.control)).toBeLessThan(1e-9);
      expect(worst(r.loadDisturbance.output, c.disturbance.output)).toBeLessThan(1e-9);
      expect(worst(r.loadDisturbance.control, c.disturbance.control)).toBeLessThan(1e-9);
      expect(r.setpointStep.finalValue).toBeCloseTo(c.setpoint.finalValue, 14);
      expect(r.loadDisturbance.finalValue).toBeCloseTo(c.disturbance.finalValue, 14);
      if (c.setpoint.peakTime !== undefined) {
        expect(Math.abs(r.setpointStep.overshootPercent! - c.setpoint.overshootPercent!)).toBeLessThan(1e-7);
        expect(relative(r.setpointStep.peakTime!, c.setpoint.peakTime)).toBeLessThan(1e-8);
        expect(relative(r.setpointStep.riseTime!, c.setpoint.time90! - c.setpoint.time10!)).toBeLessThan(1e-8);
        expect(relative(r.setpointStep.settlingTime!, c.setpoint.settlingTime!)).toBeLessThan(1e-8);
      }
      expect(relative(r.loadDisturbance.ie!, c.disturbance.ie!)).toBeLessThan(1e-8);
      expect(relative(r.loadDisturbance.iae!, c.disturbance.iae!)).toBeLessThan(1e-8);
    });
  }
});

describe('simulateClosedLoop: load disturbance under PI control of a first-order lag', () => {
  // P = K/(τs + 1), C = kp(1 + 1/(Ti s)), unit step at the plant input, setpoint 0.
  const K = 2;
  const tau = 1;
  const kp = 1;
  const Ti = 2;
  const controller = { numerator: [kp * Ti, kp], denominator: [Ti, 0] };
  it('has IE = −Ti/kp, IAE = IE in magnitude and the closed-form peak (no delay)', () => {
    const r = simulateClosedLoop({ plant: { numerator: [K], denominator: [tau, 1], delay: 0 }, controller, duration: 80 });
    const d = r.loadDisturbance;
    // Integral action: zero offset (final-value theorem, common practice).
    expect(d.finalValue).toBe(0);
    // ∫e dt = −Ti/Kc for a unit load step (Åström & Hägglund, Advanced PID Control, IE = Ti/Kc
    // in magnitude (from memory); follows from u∞ = −1 = Kc/Ti·∫e dt).
    expect(relative(d.ie!, -Ti / kp)).toBeLessThan(1e-9);
    // Y/D = P/(1 + CP) = 2/(s² + 3s + 1) for these numbers (derivation): real roots
    // r1,2 = (−3 ± √5)/2, y = (2/√5)(e^{r1 t} − e^{r2 t}) ≥ 0, so IAE = |IE|.
    expect(relative(d.iae!, Ti / kp)).toBeLessThan(1e-9);
    const r1 = (-3 + Math.sqrt(5)) / 2;
    const r2 = (-3 - Math.sqrt(5)) / 2;
    const tPeak = Math.log(r2 / r1) / (r1 - r2);
    const yPeak = (2 / Math.sqrt(5)) * (Math.exp(r1 * tPeak) - Math.exp(r2 * tPeak));
    expect(relative(d.peakDeviationTime!, tPeak)).toBeLessThan(1e-9);
    expect(relative(d.peakDeviation!, yPeak)).toBeLessThan(1e-13);
  });

  it('keeps IE = −Ti/kp with a delay', () => {
    const r = simulateClosedLoop({ plant: { numerator: [K], denominator: [tau, 1], delay: 0.3 }, controller, duration: 100 });
    expect(r.stable).toBe(true);
    expect(relative(r.loadDisturbance.ie!, -Ti / kp)).toBeLessThan(1e-9);
  });
});

describe('simulateClosedLoop: unstable loops', () => {
  it('reports no figures beyond the delay margin of k·e^{−sT}/s (stable iff kT < π/2)', () => {
    // Loop k e^{−sT}/s: PM = π/2 − kT (REFERENCES.md, derivation).
    const loop = (k: number) =>
      simulateClosedLoop({ plant: { numerator: [1], denominator: [1, 0], delay: 1 }, controller: { numerator: [k], denominator: [1] } });
    const stable = loop(1.5);
    expect(stable.stable).toBe(true);
    expect(stable.setpointStep.overshootPercent).toBeGreaterThan(0);
    const unstable = loop(1.6);
    expect(unstable.stable).toBe(false);
    expect(unstable.stability.reason).toMatch(/right half-plane/);
    expect(unstable.setpointStep.overshootPercent).toBeNull();
    expect(unstable.setpointStep.steadyStateError).toBeNull();
    expect(unstable.loadDisturbance.iae).toBeNull();
    expect(unstable.setpointStep.output.length).toBe(1000);
  });

  it('flags an unstable delay-free loop: 1/(s − 1) under kp = 0.5 has its root at +0.5', () => {
    const r = simulateClosedLoop({ plant: { numerator: [1], denominator: [1, -1], delay: 0 }, controller: { numerator: [0.5], denominator: [1] } });
    expect(r.stable).toBe(false);
    expect(r.stability.unstableRootCount).toBe(1);
    // y = −(1 − e^{0.5t}) for this loop (derivation): it grows like e^{t/2}.
    const last = r.time.length - 1;
    expect(relative(r.setpointStep.output[last], Math.exp(0.5 * r.time[last]) - 1)).toBeLessThan(1e-10);
  });

  it('flags a delayed loop with |C(∞)P(∞)| ≥ 1 as neutral and not stable', () => {
    const r = simulateClosedLoop({
      plant: { numerator: [1, 1], denominator: [1, 2], delay: 0.2 },
      controller: { numerator: [1.5], denominator: [1] },
    });
    expect(r.stable).toBe(false);
    expect(r.stability.reason).toMatch(/neutral/);
  });
});

describe('simulateClosedLoop: input checks', () => {
  it('rejects an improper controller', () => {
    expect(() =>
      simulateClosedLoop({ plant: { numerator: [1], denominator: [1, 1], delay: 0 }, controller: { numerator: [1, 0], denominator: [1] } }),
    ).toThrow(TimeResponseInputError);
  });
  it('rejects an ill-posed loop without delay (1 + C(∞)P(∞) = 0)', () => {
    try {
      simulateClosedLoop({ plant: { numerator: [1, 0], denominator: [1, 1], delay: 0 }, controller: { numerator: [-1], denominator: [1] } });
      expect.unreachable();
    } catch (e) {
      expect((e as TimeResponseInputError).code).toBe('LOOP_NOT_WELL_POSED');
    }
  });
});
