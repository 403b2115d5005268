/**
 * Property tests over random loops (fast-check): the universal bounds that
 * tie margins to peaks hold, and the Nyquist verdict agrees with the
 * closed-loop roots.
 *
 * Bounds (Skogestad & Postlethwaite, Multivariable Feedback Control, 2nd ed.,
 * §2.4.3, derivable from |1 + L| ≥ 1/Ms and |T| ≤ Mt):
 *   GM ≥ Ms/(Ms − 1),  PM ≥ 2·asin(1/(2·Ms)),  GM ≥ 1 + 1/Mt,  PM ≥ 2·asin(1/(2·Mt)).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';

/** A stable plant of order 1–4 from real and complex poles, with an optional delay, under a PID. */
const loopArbitrary = fc
  .record({
    poles: fc.array(fc.double({ min: 0.05, max: 20, noNaN: true }), { minLength: 1, maxLength: 3 }),
    pair: fc.option(fc.record({ wn: fc.double({ min: 0.1, max: 10, noNaN: true }), zeta: fc.double({ min: 0.15, max: 0.9, noNaN: true }) }), { nil: undefined }),
    gain: fc.double({ min: 0.2, max: 5, noNaN: true }),
    delay: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 1, noNaN: true })),
    kp: fc.double({ min: 0.1, max: 5, noNaN: true }),
    ti: fc.option(fc.double({ min: 0.2, max: 20, noNaN: true }), { nil: undefined }),
    td: fc.option(fc.double({ min: 0.01, max: 2, noNaN: true }), { nil: undefined }),
  })
  .map((r) => {
    const poles: (number | { re: number; im: number })[] = r.poles.map((p) => -p);
    if (r.pair) {
      const re = -r.pair.zeta * r.pair.wn;
      const im = r.pair.wn * Math.sqrt(1 - r.pair.zeta * r.pair.zeta);
      poles.push({ re, im }, { re, im: -im });
    }
    const scale = poles.reduce<number>((k, p) => k * (typeof p === 'number' ? -p : p.re * p.re + p.im * p.im), 1);
    return {
      plant: { kind: 'zeros-poles', zeros: [], poles, gain: r.gain * scale, delay: r.delay },
      controller: {
        kind: 'pid',
        form: 'standard',
        gain: r.kp,
        ...(r.ti ? { integralTime: r.ti } : {}),
        ...(r.td ? { derivativeTime: r.td, derivativeFilter: { n: 10 } } : {}),
      },
      detail: 'summary',
    };
  });

describe('properties over random loops', () => {
  it('stable closed loops satisfy the margin–peak bounds', () => {
    fc.assert(
      fc.property(loopArbitrary, (body) => {
        const r = analyze(body);
        if (!r.stability.closedLoopStable) return;
        const ms = r.peaks.sensitivity.value;
        const mt = r.peaks.complementarySensitivity.value;
        const slack = 1 + 1e-9;
        for (const pc of r.margins.phaseCrossovers) {
          if (pc.frequency === 0) continue;
          // GM here as the factor to the critical point; for ratios below 1 (gain reduction) the bound applies to 1/GM.
          const gm = pc.ratio >= 1 ? pc.ratio : 1 / pc.ratio;
          if (ms > 1) expect(gm * slack).toBeGreaterThanOrEqual(ms / (ms - 1));
          if (pc.ratio > 1) expect(gm * slack).toBeGreaterThanOrEqual(1 + 1 / mt);
        }
        for (const gc of r.margins.gainCrossovers) {
          const pm = (gc.phaseMarginDegrees * Math.PI) / 180;
          expect(pm * slack + 1e-12).toBeGreaterThanOrEqual(2 * Math.asin(Math.min(1, 1 / (2 * ms))));
          expect(pm * slack + 1e-12).toBeGreaterThanOrEqual(2 * Math.asin(Math.min(1, 1 / (2 * mt))));
        }
      }),
      { numRuns: 300, seed: 20261201 },
    );
  });

  it('the Nyquist count equals the number of closed-loop poles in the right half-plane (delay-free loops)', () => {
    const unstableToo = loopArbitrary.map((b) => ({ ...b, plant: { ...b.plant, delay: 0 }, controller: { ...b.controller, gain: b.controller.gain * 8 } }));
    let unstable = 0;
    fc.assert(
      fc.property(fc.oneof(loopArbitrary.map((b) => ({ ...b, plant: { ...b.plant, delay: 0 } })), unstableToo), (body) => {
        const r = analyze(body);
        expect(r.stability.method).toBe('nyquist-and-roots');
        const rhp = r.stability.closedLoopPoles!.filter((p) => p.re >= 0).length;
        expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(rhp);
        expect(r.stability.closedLoopStable).toBe(rhp === 0);
        if (rhp > 0) unstable++;
      }),
      { numRuns: 300, seed: 7 },
    );
    expect(unstable).toBeGreaterThan(10); // both verdicts were exercised
  });
});
