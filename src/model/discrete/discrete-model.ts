/**
 * A discrete-time rational transfer function G(z) = N(z)/D(z)·z^(−d) with
 * sample period Ts, as a FrequencyModel evaluated on the unit circle,
 * z = e^{jωTs}, for 0 < ω ≤ π/Ts (the Nyquist frequency).
 *
 * The FrequencyModel fields keep their continuous-time meaning through the
 * map s = ln(z)/Ts, which takes the unit circle to the imaginary axis and
 * the outside of the circle to the right half-plane: `poles`/`zeros` are
 * those continuous equivalents (roots at z = 0 have none and are left out),
 * so `integrators` counts poles at z = 1, `imaginaryAxisPoles` the poles on
 * the unit circle (at frequency arg(z)/Ts) and `unstablePoles` those outside
 * it; near z = 1, e^{jωTs} − 1 ≈ jωTs, so `lowFrequencyGain` is the gain of
 * the asymptote K0/(jω)^m as for continuous models. `rational` is null (its
 * polynomials are in s); the z-domain polynomials are in `discrete`.
 * `relativeDegree` and `highFrequencyGain` describe z → ∞ (causality and
 * direct feedthrough), not ω → ∞.
 *
 * Evaluation: a polynomial whose roots are known precisely is evaluated in
 * factored form in w = z − 1 = e^{jωTs} − 1 (computed without cancellation,
 * see complexExpm1), so that poles and zeros crowding z = 1 under fast
 * sampling keep their relative accuracy; otherwise by Horner's rule in z.
 */
import type { Complex } from '../../numeric/complex.js';
import { complexLog1p } from '../../numeric/complex-exponential.js';
import { fromRoots, trimLeading } from '../../numeric/polynomial.js';
import { polynomialRoots } from '../../numeric/polynomial-roots.js';
import type { FrequencyModel } from '../frequency-model.js';
import { ModelError } from '../model-error.js';
import { rootStructure } from '../root-structure.js';

export interface DiscreteTransferFunction {
  samplePeriod: number;
  /** Descending powers of z, without the z^(−d) factor. */
  numerator: number[];
  denominator: number[];
  /** Whole samples of pure delay: the factor z^(−delaySamples). */
  delaySamples: number;
  /** Roots of numerator and denominator in the z-plane. */
  zeros: Complex[];
  poles: Complex[];
}

export interface DiscreteModel extends FrequencyModel {
  discrete: DiscreteTransferFunction;
}

/** p(z) = leading·Π(z − 1 − ρ_i): roots given by their offsets ρ = z − 1, known to full relative accuracy. */
export interface ShiftedFactors {
  leading: number;
  rootsMinusOne: Complex[];
}

export interface DiscreteSpec {
  samplePeriod: number;
  numerator: readonly number[] | ShiftedFactors;
  denominator: readonly number[] | ShiftedFactors;
  delaySamples?: number;
}

/** Offsets below this count as a root exactly at z = 1 (an integrator) for the loop's structure. */
const UNIT_ROOT_TOLERANCE = 1e-10;

interface Side {
  coefficients: number[];
  roots: Complex[];
  offsets: Complex[] | null;
  leading: number;
}

function side(p: readonly number[] | ShiftedFactors): Side {
  if (Array.isArray(p)) {
    const coefficients = trimLeading(p as number[]);
    return { coefficients, roots: polynomialRoots(coefficients), offsets: null, leading: coefficients[0] };
  }
  const f = p as ShiftedFactors;
  const roots = f.rootsMinusOne.map((r) => ({ re: 1 + r.re, im: r.im }));
  return { coefficients: fromRoots(roots, f.leading), roots, offsets: f.rootsMinusOne, leading: f.leading };
}

/** Continuous equivalent ln(z)/Ts of a z-plane root (null at z = 0). */
function continuousEquivalent(offset: Complex, ts: number): Complex | null {
  if (Math.hypot(offset.re, offset.im) <= UNIT_ROOT_TOLERANCE) return { re: 0, im: 0 };
  if (offset.re === -1 && offset.im === 0) return null;
  const l = complexLog1p(offset);
  if (!Number.isFinite(l.re)) return null;
  return { re: l.re / ts, im: l.im / ts };
}

const offsetsOf = (s: Side): Complex[] => s.offsets ?? s.roots.map((r) => ({ re: r.re - 1, im: r.im }));

/** Writes p(e^{jθ}) into out; w = e^{jθ} − 1 given as (wr, wi). */
function evaluator(s: Side) {
  if (s.offsets) {
    const rr = Float64Array.from(s.offsets, (r) => r.re);
    const ri = Float64Array.from(s.offsets, (r) => r.im);
    const lead = s.leading;
    return (zr: number, zi: number, wr: number, wi: number, out: Complex) => {
      let re = lead;
      let im = 0;
      for (let i = 0; i < rr.length; i++) {
        const ar = wr - rr[i];
        const ai = wi - ri[i];
        const t = re * ar - im * ai;
        im = re * ai + im * ar;
        re = t;
      }
      out.re = re;
      out.im = im;
    };
  }
  const c = s.coefficients;
  return (zr: number, zi: number, _wr: number, _wi: number, out: Complex) => {
    let re = 0;
    let im = 0;
    for (let i = 0; i < c.length; i++) {
      const t = re * zr - im * zi + c[i];
      im = re * zi + im * zr;
      re = t;
    }
    out.re = re;
    out.im = im;
  };
}

export function discreteRationalModel(spec: DiscreteSpec, path: (string | number)[] = []): DiscreteModel {
  const ts = spec.samplePeriod;
  const d = spec.delaySamples ?? 0;
  const num = side(spec.numerator);
  const den = side(spec.denominator);
  if (den.coefficients.every((c) => c === 0)) {
    throw new ModelError('zero_denominator', 'The denominator is identically zero.', [...path, 'denominator']);
  }
  const degreeN = num.coefficients.length - 1;
  const degreeD = den.coefficients.length - 1;
  const relativeDegree = degreeD - degreeN + d;

  const equivalents = (s: Side) =>
    offsetsOf(s)
      .map((r) => continuousEquivalent(r, ts))
      .filter((r): r is Complex => r !== null);
  const poles = equivalents(den);
  const zeros = equivalents(num);
  const structure = rootStructure(poles, zeros);

  // K0 = R(1)/Ts^m with R(z) = G(z)·(z − 1)^m: the product over roots away from z = 1 of (1 − z_i).
  const lowFrequencyGain = (() => {
    let re = num.leading / den.leading;
    let im = 0;
    const times = (o: Complex, power: 1 | -1) => {
      if (Math.hypot(o.re, o.im) <= UNIT_ROOT_TOLERANCE) return;
      // multiply or divide by (1 − z) = −o
      const ar = -o.re;
      const ai = -o.im;
      if (power === 1) {
        const t = re * ar - im * ai;
        im = re * ai + im * ar;
        re = t;
      } else {
        const q = ar * ar + ai * ai;
        const t = (re * ar + im * ai) / q;
        im = (im * ar - re * ai) / q;
        re = t;
      }
    };
    offsetsOf(num).forEach((o) => times(o, 1));
    offsetsOf(den).forEach((o) => times(o, -1));
    return re / Math.pow(ts, structure.integrators);
  })();

  const evalN = evaluator(num);
  const evalD = evaluator(den);
  const a: Complex = { re: 0, im: 0 };
  const b: Complex = { re: 0, im: 0 };
  const evaluate = (omega: number, out: Complex): Complex => {
    const theta = omega * ts;
    const zr = Math.cos(theta);
    const zi = Math.sin(theta);
    const h = Math.sin(theta / 2);
    const wr = -2 * h * h;
    evalN(zr, zi, wr, zi, a);
    evalD(zr, zi, wr, zi, b);
    const bb = b.re * b.re + b.im * b.im;
    let re = (a.re * b.re + a.im * b.im) / bb;
    let im = (a.im * b.re - a.re * b.im) / bb;
    if (d !== 0) {
      const c = Math.cos(d * theta);
      const s = -Math.sin(d * theta);
      const t = re * c - im * s;
      im = re * s + im * c;
      re = t;
    }
    out.re = re;
    out.im = im;
    return out;
  };

  const nyquistFrequency = Math.PI / ts;
  const characteristicFrequencies = [...poles, ...zeros]
    .map((r) => Math.hypot(r.re, r.im))
    .filter((w) => w > 0 && Number.isFinite(w));
  characteristicFrequencies.push(nyquistFrequency);

  return {
    evaluate,
    rational: null,
    poles,
    zeros,
    delay: 0,
    // The phase of z^(−k) turns at k·Ts per rad/s; the grid spaces its points accordingly.
    phaseRate: (d + Math.max(0, degreeD - degreeN)) * ts,
    integrators: structure.integrators,
    imaginaryAxisPoles: structure.imaginaryAxisPoles,
    unstablePoles: structure.unstablePoles,
    unstablePolesAssumed: false,
    relativeDegree,
    highFrequencyGain: relativeDegree > 0 ? 0 : num.coefficients[0] / den.coefficients[0],
    lowFrequencyGain,
    characteristicFrequencies,
    magnitudeBoundAbove: () => Infinity,
    deviationBoundAbove: () => Infinity,
    exact: true,
    discrete: {
      samplePeriod: ts,
      numerator: num.coefficients,
      denominator: den.coefficients,
      delaySamples: d,
      zeros: num.roots,
      poles: den.roots,
    },
  };
}
