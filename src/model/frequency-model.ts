/**
 * What the analysis needs to know about a transfer function (a plant, a
 * controller, or the loop made of both): how to evaluate it on the imaginary
 * axis, and what is known about its structure.
 */
import type { Complex } from '../numeric/complex.js';
import type { RationalFactors } from './rational-kernel.js';

export interface RationalPart {
  /** Descending powers of s. */
  numerator: number[];
  denominator: number[];
}

export interface FrequencyModel {
  /** Writes G(jω) into `out` and returns it. Must not allocate. */
  evaluate(omega: number, out: Complex): Complex;
  /**
   * Writes G(jω_k) into re[k], im[k] for k < count: many frequencies in one call, for
   * models that can do that faster than one call per point (see evaluate-all.ts).
   * Optional; where given it must agree with `evaluate` bit for bit.
   */
  evaluateBatch?(omega: ArrayLike<number>, re: Float64Array, im: Float64Array, count: number): void;
  /** The rational factor when the model is rational times a pure delay; null otherwise. */
  rational: RationalPart | null;
  /**
   * The same model as coefficient-form factors and a delay, where it is one
   * (rational-kernel.ts): a product of two such models is evaluated as one.
   */
  rationalFactors?: RationalFactors;
  /** Poles of the rational factor (null when not known). */
  poles: Complex[] | null;
  /** Zeros of the rational factor (null when not known). */
  zeros: Complex[] | null;
  /** Pure delay in seconds. */
  delay: number;
  /**
   * Largest rate −dφ/dω (seconds) at which the phase keeps turning at high
   * frequency: the delay for rational models, an estimate for expressions.
   * The grid spaces its points so that this rotation cannot alias.
   */
  phaseRate: number;
  /** Net number of poles at s = 0 (poles minus zeros there). */
  integrators: number;
  /** Positive frequencies of poles on the imaginary axis other than s = 0, with their net order. */
  imaginaryAxisPoles: { frequency: number; order: number }[];
  /** Poles strictly in the right half-plane. */
  unstablePoles: number;
  /** True when `unstablePoles` was assumed rather than known. */
  unstablePolesAssumed: boolean;
  /** Degree of the denominator minus that of the numerator; null when unknown. */
  relativeDegree: number | null;
  /** Limit of the rational factor as s → ∞ (0 when strictly proper); NaN when unknown. */
  highFrequencyGain: number;
  /**
   * Value of the rational factor at s = 0 after removing `integrators`
   * (the low-frequency asymptote is gain·s^(−integrators)); NaN when unknown.
   */
  lowFrequencyGain: number;
  /** Frequencies (rad/s) where the model's behaviour changes: corner frequencies, 1/delay... */
  characteristicFrequencies: number[];
  /**
   * An upper bound of |G(jν)| valid for every ν ≥ omega, nonincreasing in
   * omega (Infinity when none is known).
   */
  magnitudeBoundAbove(omega: number): number;
  /** Same bound for |G(jν) − G(∞)·e^{−jνT}|, used for biproper loops. */
  deviationBoundAbove(omega: number): number;
  /** Relative cost of one evaluation (about 1 for a low-order rational model); bounds the grid's point budget. */
  evaluationCost?: number;
  /** False for measured data and interpolated models. */
  exact: boolean;
  /** For measured data: the band the data covers; the analysis stays inside it. */
  sampledBand?: { min: number; max: number; frequencies: Float64Array };
  /** Phase in degrees at ω on the right branch, where known (measured data); anchors the unwrapping. */
  referencePhaseDeg?: (omega: number) => number;
}
