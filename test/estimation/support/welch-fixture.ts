import { readFileSync } from 'node:fs';
import type { FrequencyResponseEstimateRequest } from '../../../src/estimation/index.js';

/** Shape of fixtures/estimation/second-order-iir-welch.json (scripts/fixtures/make_estimation_reference.py). */
export interface WelchFixtureCase {
  name: string;
  request: Partial<FrequencyResponseEstimateRequest>;
  segmentLength: number;
  overlapSamples: number;
  segments: number;
  frequencyHz: number[];
  inputSpectralDensity: number[];
  outputSpectralDensity: number[];
  magnitude: number[];
  phaseDeg: number[];
  coherence: number[];
  trueMagnitude?: number[];
  truePhaseDeg?: number[];
}

export interface WelchFixture {
  scipyVersion: string;
  sampleRate: number;
  filter: { b: number[]; a: number[] };
  input: number[];
  output: number[];
  cases: WelchFixtureCase[];
}

export function loadWelchFixture(): WelchFixture {
  const url = new URL('../../../fixtures/estimation/second-order-iir-welch.json', import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as WelchFixture;
}

/** Largest |a−b| / max(|b|, floor) over two arrays, for reporting how close they are. */
export function maxRelativeDifference(actual: ArrayLike<number>, expected: ArrayLike<number>, floor = 0): number {
  if (actual.length !== expected.length) return Infinity;
  let worst = 0;
  for (let i = 0; i < expected.length; i++) {
    const d = Math.abs(actual[i] - expected[i]) / Math.max(Math.abs(expected[i]), floor);
    if (!(d <= worst)) worst = d;
  }
  return worst;
}
