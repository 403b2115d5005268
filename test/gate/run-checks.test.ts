import { describe, expect, it } from 'vitest';
import { runChecks } from '../../src/gate/run-checks.js';
import { LoopgateError } from '../../src/contract/errors.js';
import type { CheckResponse } from '../../src/contract/schemas/checks.js';
import {
  NO_THRESHOLDS,
  delayForPhaseMargin,
  delayedIntegrator,
  delayedIntegratorDelayMargin,
  delayedIntegratorPhaseMarginDeg,
  secondOrderLoop,
  secondOrderMs,
  secondOrderMt,
  thirdOrderGainFor,
  thirdOrderGainMarginDb,
  thirdOrderLag,
} from './support/closed-form-loops.js';

type Plant = ReturnType<typeof thirdOrderLag> | ReturnType<typeof delayedIntegrator>;

/** One loop under the baseline profile with every threshold off except `only`. */
async function judgeAlone(plant: Plant, only: Record<string, unknown>, profile = 'baseline') {
  const r = await runChecks({ criteria: { profile, ...NO_THRESHOLDS, ...only }, loops: [{ name: 'pump speed', plant }] });
  return r.loops[0];
}

async function refusal(body: unknown): Promise<LoopgateError> {
  try {
    await runChecks(body);
  } catch (err) {
    if (err instanceof LoopgateError) return err;
    throw err;
  }
  throw new Error('expected a refusal');
}

describe('runChecks: verdicts on both sides of each threshold (closed-form loops)', () => {
  it('gain margin: K/(s(s+1)(s+2)) with GM = 6/K (Ogata) at 6.5 dB passes, at 5.5 dB fails the 6 dB limit', async () => {
    const pass = await judgeAlone(thirdOrderLag(thirdOrderGainFor(6.5)), { minGainMarginDb: 6 });
    expect(pass.verdict).toBe('pass');
    expect(pass.findings).toEqual([]);
    const k = thirdOrderGainFor(5.5);
    const fail = await judgeAlone(thirdOrderLag(k), { minGainMarginDb: 6 });
    expect(fail.verdict).toBe('fail');
    expect(fail.findings).toHaveLength(1);
    expect(fail.findings[0]).toMatchObject({ code: 'gain_margin_low', limit: 6, severity: 'fail', criterion: 'minGainMarginDb', source: 'set by the caller' });
    expect(fail.findings[0].value).toBeCloseTo(thirdOrderGainMarginDb(k), 9);
    expect(fail.summary.margins.gain!.frequency).toBeCloseTo(Math.SQRT2, 9);
  });

  it('phase margin: k·e^{−sT}/s with PM = π/2 − kT at 31° passes, at 29° fails the 30° limit', async () => {
    const pass = await judgeAlone(delayedIntegrator(1, delayForPhaseMargin(1, 31)), { minPhaseMarginDegrees: 30 });
    expect(pass.verdict).toBe('pass');
    const T = delayForPhaseMargin(1, 29);
    const fail = await judgeAlone(delayedIntegrator(1, T), { minPhaseMarginDegrees: 30 });
    expect(fail.verdict).toBe('fail');
    expect(fail.findings.map((f) => f.code)).toEqual(['phase_margin_low']);
    expect(fail.findings[0].value).toBeCloseTo(delayedIntegratorPhaseMarginDeg(1, T), 8);
    expect(fail.findings[0].value).toBeCloseTo(29, 8);
  });

  it('delay margin in seconds: k·e^{−sT}/s with DM = π/(2k) − T on both sides of 0.5 s', async () => {
    // k = 2: DM = π/4 − T = 0.7854 − T.
    const pass = await judgeAlone(delayedIntegrator(2, 0.25), { minDelayMarginSeconds: 0.5 });
    expect(pass.verdict).toBe('pass');
    expect(pass.summary.margins.delay!.seconds).toBeCloseTo(delayedIntegratorDelayMargin(2, 0.25), 9);
    const fail = await judgeAlone(delayedIntegrator(2, 0.3), { minDelayMarginSeconds: 0.5 });
    expect(fail.verdict).toBe('fail');
    expect(fail.findings[0]).toMatchObject({ code: 'delay_margin_low', limit: 0.5 });
    expect(fail.findings[0].value).toBeCloseTo(delayedIntegratorDelayMargin(2, 0.3), 9);
  });

  it('delay margin as a multiple of the delay (uncertain-delay profile): DM/T = (π/2 − T)/T on both sides of 1', async () => {
    // DM ≥ T ⇔ T ≤ π/4 for k = 1.
    const only = { minDelayMarginMultiple: 1 };
    const pass = await judgeAlone(delayedIntegrator(1, 0.75), only, 'uncertain-delay');
    expect(pass.verdict).toBe('pass');
    expect(pass.summary.loopDelaySeconds).toBe(0.75);
    const fail = await judgeAlone(delayedIntegrator(1, 0.82), only, 'uncertain-delay');
    expect(fail.verdict).toBe('fail');
    expect(fail.findings[0]).toMatchObject({ code: 'delay_margin_below_multiple', limit: 1, criterion: 'minDelayMarginMultiple' });
    expect(fail.findings[0].value).toBeCloseTo(delayedIntegratorDelayMargin(1, 0.82) / 0.82, 9);
  });

  it('the uncertain-delay profile itself holds DM ≥ 1 × the delay', async () => {
    const r = await runChecks({
      criteria: { profile: 'uncertain-delay' },
      loops: [
        { name: 'short delay', plant: delayedIntegrator(0.5, 0.5) }, // PM 75.7°, DM 2.64 s = 5.3 T, GM 16 dB; Ms small
        { name: 'long delay', plant: delayedIntegrator(0.5, 1.1) }, // DM = π − 1.1 = 2.04 s = 1.86 T, but GM = π/1.1 → 9.1 dB
        { name: 'too long', plant: delayedIntegrator(1, 0.8) }, // DM = 0.771 s < T
      ],
    });
    const byName = Object.fromEntries(r.loops.map((l) => [l.name, l]));
    expect(byName['short delay'].findings.filter((f) => f.criterion === 'minDelayMarginMultiple')).toEqual([]);
    expect(byName['long delay'].findings.filter((f) => f.criterion === 'minDelayMarginMultiple')).toEqual([]);
    expect(byName['too long'].findings.find((f) => f.criterion === 'minDelayMarginMultiple')?.severity).toBe('fail');
    expect(byName['too long'].verdict).toBe('fail');
  });

  it('sensitivity peak: ωn²/(s(s+2ζωn)) with Ms in closed form, ζ = 0.6 passes and ζ = 0.5 fails Ms ≤ 1.4 (plant-changes)', async () => {
    expect(secondOrderMs(0.6)).toBeLessThan(1.4);
    expect(secondOrderMs(0.5)).toBeGreaterThan(1.4);
    const pass = await judgeAlone(secondOrderLoop(0.6) as Plant, { maxSensitivityPeak: 1.4 }, 'plant-changes');
    expect(pass.verdict).toBe('pass');
    const fail = await judgeAlone(secondOrderLoop(0.5) as Plant, { maxSensitivityPeak: 1.4 }, 'plant-changes');
    expect(fail.verdict).toBe('fail');
    expect(fail.findings[0]).toMatchObject({ code: 'sensitivity_peak_high', limit: 1.4 });
    expect(fail.findings[0].value).toBeCloseTo(secondOrderMs(0.5), 9);
  });

  it('complementary peak: Mt = 1/(2ζ√(1−ζ²)) (Ogata) — ζ = 0.47 passes, ζ = 0.43 breaches 1.25, which only warns in the baseline', async () => {
    const r = await runChecks({
      criteria: { ...NO_THRESHOLDS, maxComplementaryPeak: 1.25, severity: undefined },
      loops: [
        { name: 'damped', plant: secondOrderLoop(0.47) },
        { name: 'resonant', plant: secondOrderLoop(0.43) },
      ],
    });
    expect(r.loops[0].verdict).toBe('pass');
    expect(r.loops[1].verdict).toBe('warn');
    expect(r.loops[1].findings[0]).toMatchObject({ code: 'complementary_peak_high', severity: 'warn', limit: 1.25 });
    expect(r.loops[1].findings[0].value).toBeCloseTo(secondOrderMt(0.43), 9);
    expect(r.verdict).toBe('warn');
    expect(r.counts).toEqual({ pass: 1, warn: 1, fail: 0 });
  });

  it('an unstable closed loop fails under every profile, even with every threshold off: K = 7 > 6 on K/(s(s+1)(s+2))', async () => {
    for (const profile of ['baseline', 'plant-changes', 'uncertain-delay', 'advisory']) {
      const stable = await judgeAlone(thirdOrderLag(5), {}, profile);
      expect(stable.verdict).toBe('pass');
      const unstable = await judgeAlone(thirdOrderLag(7), {}, profile);
      expect(unstable.verdict).toBe('fail');
      expect(unstable.summary.closedLoopStable).toBe(false);
      expect(unstable.findings[0]).toMatchObject({ code: 'closed_loop_unstable', severity: 'fail', criterion: null });
    }
  });

  it('the advisory profile makes breaches warnings; a severity override makes one fail again', async () => {
    const k = thirdOrderGainFor(5.5);
    const warned = await judgeAlone(thirdOrderLag(k), { minGainMarginDb: 6 }, 'advisory');
    expect(warned.verdict).toBe('warn');
    const failed = await judgeAlone(thirdOrderLag(k), { minGainMarginDb: 6, severity: { minGainMarginDb: 'fail' } }, 'advisory');
    expect(failed.verdict).toBe('fail');
    expect(failed.overridden).toContain('minGainMarginDb');
  });
});

describe('runChecks: the batch', () => {
  it('answers version, request hash, profile, counts and the worst verdict, loops in request order', async () => {
    const body = {
      loops: [
        { name: 'a', plant: thirdOrderLag(1) },
        { name: 'b', plant: thirdOrderLag(7) },
        { name: 'c', plant: thirdOrderLag(0.5) },
      ],
    };
    const r: CheckResponse = await runChecks(body);
    expect(r.loops.map((l) => l.name)).toEqual(['a', 'b', 'c']);
    expect(r.verdict).toBe('fail');
    expect(r.profile).toBe('baseline');
    expect(r.requestHash).toMatch(/^sha256:[0-9a-f]{64}$/);
    expect(r.counts.fail).toBe(1);
    expect(r.counts.pass + r.counts.warn + r.counts.fail).toBe(3);
    expect(r.caution.length).toBeGreaterThan(20);
  });

  it('a loop with its own profile stands alone; one without is laid over the request criteria', async () => {
    const k = thirdOrderGainFor(8); // GM 8 dB: passes 6 dB, fails plant-changes' 10.9 dB
    const r = await runChecks({
      criteria: { profile: 'baseline', maxComplementaryPeak: null },
      loops: [
        { name: 'own profile', plant: thirdOrderLag(k), criteria: { profile: 'plant-changes' } },
        { name: 'override', plant: thirdOrderLag(k), criteria: { minGainMarginDb: 9 } },
      ],
    });
    expect(r.loops[0].profile).toBe('plant-changes');
    expect(r.loops[0].findings.some((f) => f.code === 'gain_margin_low')).toBe(true);
    expect(r.loops[1].profile).toBe('baseline');
    expect(r.loops[1].overridden).toEqual(['minGainMarginDb', 'maxComplementaryPeak']);
    expect(r.loops[1].findings.find((f) => f.code === 'gain_margin_low')).toMatchObject({ limit: 9, source: 'set by the caller' });
  });

  it('refuses the whole batch (422) when one loop cannot be analysed, with the path under loops[i]', async () => {
    const err = await refusal({
      loops: [
        { name: 'fine', plant: thirdOrderLag(1) },
        { name: 'broken', plant: { kind: 'transfer-function', numerator: [1], denominator: [0, 0] } },
      ],
    });
    expect(err.statusCode).toBe(422);
    expect(err.code).toBe('zero_denominator');
    expect(err.issues?.[0].path).toEqual(['loops', 1, 'plant', 'denominator']);
    expect(err.message).toContain('loops[1]');
  });

  it('reports limit and time errors under loops[i] too (413, 422)', async () => {
    const big = await refusal({ loops: [{ name: 'x', plant: { kind: 'transfer-function', numerator: [1], denominator: new Array(62).fill(1) } }] });
    expect(big.statusCode).toBe(413);
    expect(big.issues?.[0].path).toEqual(['loops', 0, 'plant', 'denominator']);
    const neg = await refusal({ loops: [{ name: 'x', plant: thirdOrderLag(1), controller: { kind: 'pid', form: 'standard', gain: 1, integralTime: -1 } }] });
    expect(neg.code).toBe('negative_time');
    expect(neg.issues?.[0].path).toEqual(['loops', 0, 'controller', 'integralTime']);
  });

  it('400 for schema errors, duplicate names and unknown profiles; 413 over 1,000 loops', async () => {
    const shape = await refusal({ loops: [{ name: 'x', plant: { kind: 'transfer-function', numerator: 'one', denominator: [1] } }] });
    expect(shape.statusCode).toBe(400);
    expect(shape.issues?.[0].path).toEqual(['loops', 0, 'plant', 'numerator']);
    const dup = await refusal({ loops: [{ name: 'x', plant: thirdOrderLag(1) }, { name: 'x', plant: thirdOrderLag(2) }] });
    expect(dup.statusCode).toBe(400);
    expect(dup.issues?.[0].path).toEqual(['loops', 1, 'name']);
    const profile = await refusal({ criteria: { profile: 'lenient' }, loops: [{ name: 'x', plant: thirdOrderLag(1) }] });
    expect(profile.statusCode).toBe(400);
    expect(profile.issues?.[0].path).toEqual(['criteria', 'profile']);
    expect((await refusal({ loops: [] })).statusCode).toBe(400);
    const many = await refusal({ loops: Array.from({ length: 1001 }, (_, i) => ({ name: `l${i}`, plant: thirdOrderLag(1) })) });
    expect(many.statusCode).toBe(413);
    expect(many.code).toBe('too_many_loops');
  });
});
