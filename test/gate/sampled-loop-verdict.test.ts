/**
 * The gate judges a digital controller as the firmware runs it: the sampled
 * loop. Closed form (Åström & Wittenmark, Computer-Controlled Systems — the
 * ZOH equivalent of a first-order lag): P = K/(τs + 1) held and sampled at Ts
 * gives b/(z − a) with a = e^{−Ts/τ}, b = K(1 − a); under P control kp the
 * closed-loop pole is a − kp·b, unstable once kp > (1 + a)/(K(1 − a)). The
 * continuous loop is stable for every kp > 0.
 */
import { describe, expect, it } from 'vitest';
import { runChecks } from '../../src/gate/run-checks.js';

const K = 1;
const tau = 1;
const Ts = 0.5;
const a = Math.exp(-Ts / tau);
const limit = (1 + a) / (K * (1 - a)); // ≈ 4.083

const loop = (name: string, kp: number, implementation = true) => ({
  name,
  plant: { kind: 'transfer-function' as const, numerator: [K], denominator: [tau, 1] },
  controller: {
    kind: 'pid' as const,
    form: 'parallel' as const,
    kp,
    ...(implementation ? { implementation: { samplePeriod: Ts, method: 'tustin' as const } } : {}),
  },
});

describe('gate verdicts on sampled loops', () => {
  it('fails a tuning whose sampled loop is unstable although its continuous design is stable', async () => {
    const r = await runChecks({ loops: [loop('too-fast', 1.05 * limit), loop('continuous-only', 1.05 * limit, false)] });
    const [sampled, continuous] = r.loops;
    expect(sampled.verdict).toBe('fail');
    expect(sampled.findings.map((f) => f.code)).toContain('closed_loop_unstable');
    expect(continuous.findings.map((f) => f.code)).not.toContain('closed_loop_unstable');
  });

  it('does not call the sampled loop unstable just below the limit', async () => {
    const r = await runChecks({ loops: [loop('just-below', 0.95 * limit)] });
    expect(r.loops[0].findings.map((f) => f.code)).not.toContain('closed_loop_unstable');
  });
});
