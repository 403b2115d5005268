/**
 * The core analysis against an independent high-precision reference:
 * fixtures/reference/loops.json, written by scripts/fixtures/make_loop_reference.py
 * (mpmath on the exact model, crossings and peaks refined to 1e-25, stability
 * counted twice: characteristic roots or the argument principle, and Nyquist).
 * Every expected value below comes from that fixture; the tolerances are the
 * contract's (margins, crossover frequencies, peak values, bandwidths relative
 * 1e-8; PM 1e-6 degrees) except peak frequencies (relative 1e-5: a maximum is
 * flat, so its location is ill-conditioned while its value is not).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';

interface Crossover {
  frequency: number;
  phaseMarginDegrees: number;
  delayMarginSeconds: number | null;
}
interface PhaseCrossover {
  frequency: number;
  ratio: number;
  db: number;
}
interface Sample {
  w: number;
  re: number;
  im: number;
  sensitivityDb: number;
  complementaryDb: number;
}
interface Expected {
  gainCrossovers: Crossover[];
  phaseCrossovers: PhaseCrossover[];
  gain: { ratio: number; db: number; frequency: number } | null;
  phase: { degrees: number; frequency: number } | null;
  delay: { seconds: number; frequency: number } | null;
  sensitivityPeak: { value: number; frequency: number };
  complementaryPeak: { value: number; frequency: number };
  bandwidth: { closedLoop: number | null; sensitivity: number | null; crossover: number | null };
  closedLoopStable: boolean;
  closedLoopUnstablePoles: number;
  openLoopUnstablePoles: number;
  integrators: number;
  closedLoopPoles?: { re: number; im: number }[];
  samples: Sample[];
}
interface ReferenceLoop {
  name: string;
  body: Record<string, unknown>;
  band: [number, number];
  expected: Expected;
  remark?: string;
}
interface Fixture {
  generator: string;
  digits: number;
  loops: ReferenceLoop[];
}

const fixture = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/loops.json', import.meta.url), 'utf8'),
) as Fixture;
const SOURCE = `${fixture.generator}, mpmath at ${fixture.digits} digits`;

const REL = 1e-8; // contract: margins, crossovers, peak values, bandwidths
const PM_DEG = 1e-6; // contract: phase margin in degrees
const PEAK_FREQ_REL = 1e-5; // a maximum is flat: its frequency is looser than its value
const DB_ABS = 20 * Math.log10(1 + REL); // a relative 1e-8 expressed in dB
const LISTED_RATIO = 1e3; // the fixture lists phase crossovers with |L| > 1e-3 only (GM < 60 dB)
const POLE_TOL = 1e-6; // closed-loop poles: no contract tolerance; ours, relative to max(1, |p|)
const UNWRAPPED_REL = 1e-10; // response phase (unwrapped): relative to its own size
const SAMPLE_MATCH = 1e-9; // a response frequency is "the" sample frequency within this

/** Collects every disagreement of one loop, so a failure lists them all. */
class Comparison {
  readonly problems: string[] = [];

  relative(what: string, actual: number | null | undefined, expected: number, tol = REL): void {
    if (typeof actual !== 'number' || !Number.isFinite(actual)) {
      this.problems.push(`${what}: got ${actual}, expected ${expected} (${SOURCE})`);
      return;
    }
    const err = Math.abs(actual - expected) / Math.max(Math.abs(expected), Number.MIN_VALUE);
    if (!(err <= tol)) this.problems.push(`${what}: got ${actual}, expected ${expected} (${SOURCE}), rel. error ${err.toExponential(2)} > ${tol}`);
  }

  absolute(what: string, actual: number | null | undefined, expected: number, tol: number): void {
    if (typeof actual !== 'number' || !Number.isFinite(actual)) {
      this.problems.push(`${what}: got ${actual}, expected ${expected} (${SOURCE})`);
      return;
    }
    const err = Math.abs(actual - expected);
    if (!(err <= tol)) this.problems.push(`${what}: got ${actual}, expected ${expected} (${SOURCE}), error ${err.toExponential(2)} > ${tol}`);
  }

  equal(what: string, actual: unknown, expected: unknown): void {
    if (actual !== expected) this.problems.push(`${what}: got ${String(actual)}, expected ${String(expected)} (${SOURCE})`);
  }

  nullOrRelative(what: string, actual: number | null | undefined, expected: number | null, tol = REL): void {
    if (expected === null) this.equal(what, actual ?? null, null);
    else this.relative(what, actual, expected, tol);
  }
}

/** Degrees difference on the circle, so 180 and -180 are the same phase. */
function phaseDifference(a: number, b: number): number {
  const d = ((a - b) % 360 + 540) % 360 - 180;
  return Math.abs(d);
}

/**
 * L(0) for loops without integrators: N(0)/D(0) of a transfer-function plant
 * times the controller's zero-frequency gain (kp or K when there is no integral
 * action); null when the loop has an integrator or the plant is of another kind.
 */
function zeroFrequencyLoopGain(body: any): number | null {
  const p = body.plant;
  if (p.kind !== 'transfer-function') return null;
  const n0 = p.numerator[p.numerator.length - 1];
  const d0 = p.denominator[p.denominator.length - 1];
  if (d0 === 0) return null;
  const c = body.controller;
  if (!c) return n0 / d0;
  if (c.form === 'parallel') return c.ki ? null : (c.kp ?? 0) * (n0 / d0);
  return c.integralTime !== undefined ? null : c.gain * (n0 / d0);
}

describe('core analysis against the mpmath reference (fixtures/reference/loops.json)', () => {
  it('has a catalogue worth the name', () => {
    expect(fixture.loops.length).toBeGreaterThanOrEqual(36);
    expect(fixture.loops.filter((l) => !l.expected.closedLoopStable).length).toBeGreaterThanOrEqual(6);
  });

  it.each(fixture.loops.map((l) => [l.name, l] as const))('%s', async (_name, loop) => {
    const result = await analyze(loop.body);
    const e = loop.expected;
    const c = new Comparison();
    const m = result.margins;

    // A loop without integrators whose L(0) is real and negative also has a phase
    // crossover at ω = 0 (a gain-reduction limit; the fixture lists ω > 0 only, so
    // that entry is derived here in closed form from the body: L(0) = C(0)·N(0)/D(0)).
    const l0 = zeroFrequencyLoopGain(loop.body);
    const atZero = l0 !== null && l0 < 0 ? { frequency: 0, ratio: 1 / -l0, db: -20 * Math.log10(-l0) } : null;
    if (atZero && (e.gain === null || Math.abs(atZero.db) < Math.abs(e.gain.db))) {
      c.relative('GM ratio (ω = 0)', m.gain?.ratio, atZero.ratio);
      c.equal('GM frequency (ω = 0)', m.gain?.frequency, 0);
    } else if (e.gain === null) c.equal('margins.gain', m.gain, null);
    else {
      c.relative('GM ratio', m.gain?.ratio, e.gain.ratio);
      c.absolute('GM dB', m.gain?.db, e.gain.db, DB_ABS);
      c.relative('GM frequency', m.gain?.frequency, e.gain.frequency);
    }
    // phase margin: the smallest over the gain crossovers
    if (e.phase === null) c.equal('margins.phase', m.phase, null);
    else {
      c.absolute('PM degrees', m.phase?.degrees, e.phase.degrees, PM_DEG);
      c.relative('PM frequency', m.phase?.frequency, e.phase.frequency);
    }
    if (e.delay === null) c.equal('margins.delay', m.delay, null);
    else {
      c.relative('delay margin', m.delay?.seconds, e.delay.seconds);
      c.relative('delay margin frequency', m.delay?.frequency, e.delay.frequency);
    }

    // every gain crossover, ascending frequency
    c.equal('number of gain crossovers', m.gainCrossovers.length, e.gainCrossovers.length);
    e.gainCrossovers.forEach((x, i) => {
      const got = m.gainCrossovers[i];
      c.relative(`gain crossover ${i} frequency`, got?.frequency, x.frequency);
      c.absolute(`gain crossover ${i} PM`, got?.phaseMarginDegrees, x.phaseMarginDegrees, PM_DEG);
      c.nullOrRelative(`gain crossover ${i} delay margin`, got?.delayMarginSeconds, x.delayMarginSeconds);
    });

    // phase crossovers with |L| > 1e-3 (GM < 60 dB), matched by frequency
    const listed = m.phaseCrossovers.filter((x) => x.ratio < LISTED_RATIO && x.frequency > 0);
    c.equal('phase crossover at ω = 0 listed', m.phaseCrossovers.some((x) => x.frequency === 0), atZero !== null);
    c.equal('number of phase crossovers with GM < 60 dB', listed.length, e.phaseCrossovers.length);
    const byFrequency = <T extends { frequency: number }>(xs: T[]) => [...xs].sort((a, b) => a.frequency - b.frequency);
    const gotPc = byFrequency(listed);
    byFrequency(e.phaseCrossovers).forEach((x, i) => {
      c.relative(`phase crossover near ${x.frequency.toPrecision(6)} frequency`, gotPc[i]?.frequency, x.frequency);
      c.relative(`phase crossover near ${x.frequency.toPrecision(6)} ratio`, gotPc[i]?.ratio, x.ratio);
      c.absolute(`phase crossover near ${x.frequency.toPrecision(6)} dB`, gotPc[i]?.db, x.db, DB_ABS);
    });
    // contract: nearest to instability first
    for (let i = 1; i < m.phaseCrossovers.length; i++) {
      if (Math.abs(m.phaseCrossovers[i].db) < Math.abs(m.phaseCrossovers[i - 1].db)) {
        c.problems.push(`phaseCrossovers not in ascending |dB| at index ${i}`);
        break;
      }
    }

    // peaks: strict on the value, looser on the (flat) location
    const p = result.peaks;
    c.relative('Ms', p.sensitivity.value, e.sensitivityPeak.value);
    c.absolute('Ms dB', p.sensitivity.db, 20 * Math.log10(e.sensitivityPeak.value), DB_ABS);
    c.relative('Ms frequency', p.sensitivity.frequency, e.sensitivityPeak.frequency, PEAK_FREQ_REL);
    c.relative('Mt', p.complementarySensitivity.value, e.complementaryPeak.value);
    c.absolute('Mt dB', p.complementarySensitivity.db, 20 * Math.log10(e.complementaryPeak.value), DB_ABS);
    c.relative('Mt frequency', p.complementarySensitivity.frequency, e.complementaryPeak.frequency, PEAK_FREQ_REL);

    // bandwidths
    c.nullOrRelative('closed-loop bandwidth', result.bandwidth.closedLoop, e.bandwidth.closedLoop);
    c.nullOrRelative('sensitivity bandwidth', result.bandwidth.sensitivity, e.bandwidth.sensitivity);
    c.nullOrRelative('crossover bandwidth', result.bandwidth.crossover, e.bandwidth.crossover);

    // stability verdict and counts
    const s = result.stability;
    c.equal('closedLoopStable', s.closedLoopStable, e.closedLoopStable);
    c.equal('closed-loop unstable poles (Nyquist)', s.nyquist.closedLoopUnstablePoles, e.closedLoopUnstablePoles);
    c.equal('open-loop unstable poles', s.openLoopUnstablePoles, e.openLoopUnstablePoles);
    c.equal('integrators', s.integrators, e.integrators);
    if (e.closedLoopPoles) {
      const got = s.closedLoopPoles ?? [];
      c.equal('number of closed-loop poles', got.length, e.closedLoopPoles.length);
      for (const q of e.closedLoopPoles) {
        const nearest = Math.min(...got.map((g) => Math.hypot(g.re - q.re, g.im - q.im)));
        if (!(nearest <= POLE_TOL * Math.max(1, Math.hypot(q.re, q.im)))) {
          c.problems.push(`closed-loop pole ${q.re} + ${q.im}j: nearest reported is ${nearest} away (${SOURCE})`);
        }
      }
    }

    // response samples at the requested frequencies
    const r = result.response;
    if (!r) c.problems.push('no response although the body asks for one');
    else {
      for (const x of e.samples) {
        const i = r.frequency.findIndex((w) => Math.abs(w - x.w) <= SAMPLE_MATCH * x.w);
        if (i < 0) {
          c.problems.push(`response has no point at w = ${x.w}`);
          continue;
        }
        const mag = Math.hypot(x.re, x.im);
        c.absolute(`Re L(j${x.w})`, r.loop.real[i], x.re, REL * mag);
        c.absolute(`Im L(j${x.w})`, r.loop.imag[i], x.im, REL * mag);
        c.absolute(`|L(j${x.w})| dB`, r.loop.magnitudeDb[i], 20 * Math.log10(mag), DB_ABS);
        const phase = (Math.atan2(x.im, x.re) * 180) / Math.PI;
        // the response phase is unwrapped (with a delay it reaches -1e7 degrees); it carries the
        // rounding of the turns it was built from, so it is held to 1e-10 of its size (at least 1e-6 deg)
        const dPhase = phaseDifference(r.loop.phaseDeg[i], phase);
        if (!(dPhase <= Math.max(PM_DEG, UNWRAPPED_REL * Math.abs(r.loop.phaseDeg[i])))) c.problems.push(`phase of L(j${x.w}): got ${r.loop.phaseDeg[i]}, expected ${phase} mod 360 (${SOURCE})`);
        c.absolute(`|S(j${x.w})| dB`, r.sensitivity.magnitudeDb[i], x.sensitivityDb, DB_ABS);
        c.absolute(`|T(j${x.w})| dB`, r.complementarySensitivity.magnitudeDb[i], x.complementaryDb, DB_ABS);
      }
    }

    expect(c.problems, `${loop.name}${loop.remark ? ` (${loop.remark})` : ''}`).toEqual([]);
  });
});
