/** Types and loader of fixtures/discrete/discretisations.json (scripts/fixtures/make_discretisation_reference.py). */
import { readFileSync } from 'node:fs';

export interface ControllerCase {
  name: string;
  controller: Record<string, unknown>;
  continuous: { numerator: number[]; denominator: number[] };
  implementation: { samplePeriod: number; method: 'tustin' | 'tustin-prewarp' | 'backward-euler' | 'forward-euler'; prewarpFrequency?: number };
  expected: { numerator: number[]; denominator: number[] };
}
export interface HoldPlantCase {
  name: string;
  numerator: number[];
  denominator: number[];
  samplePeriod: number;
  expected: { numerator: number[]; denominator: number[] };
}
export interface PulseCase {
  name: string;
  plant: { kind: 'zeros-poles'; gain: number; zeros: (number | { re: number; im: number })[]; poles: (number | { re: number; im: number })[]; delay: number };
  samplePeriod: number;
  pulseResponse: number[];
}
export interface LoopCase {
  name: string;
  body: Record<string, unknown> & { controller: { implementation: { samplePeriod: number } } };
  expected: {
    closedLoopPoleMagnitudes: number[];
    gainCrossovers: { frequency: number; phaseMarginDegrees: number }[];
    phaseCrossovers: { frequency: number; ratio: number }[];
    sensitivityPeakOnGrid: number;
    noiseGain: number | null;
  };
}
export interface DiscretisationFixture {
  generator: string;
  controllers: ControllerCase[];
  holdPlants: HoldPlantCase[];
  pulses: PulseCase[];
  loops: LoopCase[];
}

export const discretisationFixture = (): DiscretisationFixture =>
  JSON.parse(readFileSync('fixtures/discrete/discretisations.json', 'utf8')) as DiscretisationFixture;

/** Coefficients scaled so the denominator's leading coefficient is 1. */
export function normalised(numerator: number[], denominator: number[]): { numerator: number[]; denominator: number[] } {
  const lead = denominator[0];
  return { numerator: numerator.map((c) => c / lead), denominator: denominator.map((c) => c / lead) };
}

/** First `count` samples of the impulse response of N(z)/(D(z)·z^d), by the difference equation. */
export function impulseResponse(numerator: number[], denominator: number[], delaySamples: number, count: number): number[] {
  const den = [...denominator, ...new Array<number>(delaySamples).fill(0)];
  const n = den.length - 1;
  const num = [...new Array<number>(den.length - numerator.length).fill(0), ...numerator];
  // y_k·den0 = Σ num_i·u_{k−i} − Σ_{i≥1} den_i·y_{k−i}, u the unit pulse (coefficients in powers of z^{−1} after dividing by z^n)
  const y: number[] = [];
  for (let k = 0; k < count; k++) {
    let s = k <= n ? num[k] : 0;
    for (let i = 1; i <= n && i <= k; i++) s -= den[i] * y[k - i];
    y.push(s / den[0]);
  }
  return y;
}
