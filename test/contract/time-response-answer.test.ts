/**
 * `timeResponse` in the analysis, end to end through analyze(). The loop
 * L(s) = 1/(s(s + 1)) closes to T(s) = 1/(s² + s + 1), ζ = 0.5, ωn = 1, whose
 * unit step response is y = 1 − e^{−t/2}(cos ωd t + sin(ωd t)/√3), ωd = √3/2,
 * with overshoot e^{−π/√3} = 16.30 % at t = π/ωd = 3.628 s (Ogata, Modern
 * Control Engineering, 5th ed., §5-3). Without a controller (C = 1) the load
 * step at the plant input gives the same y. Rise and settling times are
 * found here by bisection on that closed form.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { LoopgateError } from '../../src/contract/errors.js';
import { FILLER_PUMP_SPEED_LOOP } from '../../src/demo/bottling-plant.js';

const wd = Math.sqrt(3) / 2;
const y = (t: number) => 1 - Math.exp(-t / 2) * (Math.cos(wd * t) + Math.sin(wd * t) / Math.sqrt(3));

function firstCrossing(level: number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (y(mid) < level) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Last time |y − 1| = 0.02, scanning back from 20 s then bisecting. */
function settlingTime(): number {
  let t = 20;
  while (Math.abs(y(t) - 1) <= 0.02) t -= 1e-3;
  let lo = t;
  let hi = t + 1e-3;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (Math.abs(y(mid) - 1) > 0.02) lo = mid;
    else hi = mid;
  }
  return lo;
}

const integrating = { plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 1, 0] } };

describe('analysis timeResponse', () => {
  const a = analyze({ ...integrating, timeResponse: { duration: 20, points: 401 } });
  const tr = a.timeResponse!;

  it('is present only when asked for', () => {
    expect(analyze(integrating).timeResponse).toBeUndefined();
    expect(tr).toBeDefined();
    expect(tr.stable).toBe(true);
    expect(tr.setpoint.time.length).toBe(401);
    expect(tr.setpoint.time[400]).toBe(20);
  });

  it('matches the closed-form step response and its figures', () => {
    for (let i = 0; i < tr.setpoint.time.length; i++) {
      expect(tr.setpoint.output[i]).toBeCloseTo(y(tr.setpoint.time[i]), 8);
      expect(tr.loadDisturbance.output[i]).toBeCloseTo(y(tr.setpoint.time[i]), 8);
    }
    expect(tr.setpoint.overshootPercent!).toBeCloseTo(100 * Math.exp(-Math.PI / Math.sqrt(3)), 6);
    expect(tr.setpoint.peakTime!).toBeCloseTo(Math.PI / wd, 6);
    expect(tr.setpoint.riseTime!).toBeCloseTo(firstCrossing(0.9, 0, 3) - firstCrossing(0.1, 0, 3), 6);
    expect(tr.setpoint.settlingTime!).toBeCloseTo(settlingTime(), 5);
    expect(tr.setpoint.finalValue).toBe(1);
    expect(tr.setpoint.steadyStateError).toBe(0);
    // max |y| of the load response is the same peak: 1 + 0.1630.
    expect(tr.loadDisturbance.peakDeviation!).toBeCloseTo(1 + Math.exp(-Math.PI / Math.sqrt(3)), 6);
  });

  it('simulates a rational plant with delay under PI control (the filler-pump demo)', () => {
    const pump = analyze({ ...FILLER_PUMP_SPEED_LOOP.request, timeResponse: {} }).timeResponse!;
    expect(pump.stable).toBe(true);
    // Integral action: T(0) = 1 exactly, and a load step is rejected (final value 0).
    expect(pump.setpoint.finalValue).toBe(1);
    expect(pump.loadDisturbance.finalValue).toBe(0);
    expect(pump.method).toMatch(/method of steps/);
  });

  it('says why there is none for an expression plant', () => {
    const e = analyze({ plant: { kind: 'expression', expression: '1/(s+1)^3' }, timeResponse: {} });
    expect(e.timeResponse).toBeUndefined();
    const w = e.warnings.find((x) => x.code === 'time_response_unavailable');
    expect(w?.message).toMatch(/no rational model/);
  });

  it('says the inverse-FFT path for measured data is not built yet', () => {
    // Samples of 1/(s + 1)³ on a log grid, given as a measured frequency response.
    const frequency = Array.from({ length: 120 }, (_, i) => Math.pow(10, -2 + (4 * i) / 119));
    const magnitude = frequency.map((w) => Math.pow(1 + w * w, -1.5));
    const phase = frequency.map((w) => (-3 * Math.atan(w) * 180) / Math.PI);
    const m = analyze({ plant: { kind: 'frequency-response', frequency, magnitude, phase, openLoopUnstablePoles: 0 }, controller: { kind: 'pid', form: 'standard', gain: 1, integralTime: 2 }, timeResponse: {}, detail: 'summary' });
    expect(m.timeResponse).toBeUndefined();
    expect(m.warnings.find((x) => x.code === 'time_response_unavailable')?.message).toMatch(/inverse FFT .* not available yet/);
  });

  it('refuses out-of-range options', () => {
    expect(() => analyze({ ...integrating, timeResponse: { points: 1 } })).toThrow(LoopgateError);
    expect(() => analyze({ ...integrating, timeResponse: { duration: -1 } })).toThrow(LoopgateError);
    expect(() => analyze({ ...integrating, timeResponse: { points: 20001 } })).toThrow(LoopgateError);
  });
});
