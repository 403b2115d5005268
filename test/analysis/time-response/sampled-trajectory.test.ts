import { describe, expect, it } from 'vitest';
import { evaluateAtTime, sampleTime, uniformStepStarts, type SampledTrajectory } from '../../../src/analysis/time-response/sampled-trajectory.js';

const calls: Array<[number, number]> = [];
const fake: SampledTrajectory = {
  stepStarts: uniformStepStarts(0.5, 4),
  stepCount: 4,
  nodes: [0, 0.5, 1],
  nodeOutput: new Float64Array(12),
  evaluate: (k, s) => {
    calls.push([k, s]);
    return { output: (k + s) * 0.5, control: 0, outputRate: 0, outputIntegral: 0 };
  },
};

describe('sampled trajectory helpers', () => {
  it('map a sample index to its time', () => {
    expect(sampleTime(fake, 0)).toBe(0);
    expect(sampleTime(fake, 4)).toBe(0.75);
    expect(sampleTime(fake, 5)).toBe(1);
  });
  it('evaluate right-continuously and clamp to the simulated span', () => {
    evaluateAtTime(fake, 1);
    expect(calls.at(-1)).toEqual([2, 0]);
    evaluateAtTime(fake, 2);
    expect(calls.at(-1)).toEqual([3, 1]);
    expect(evaluateAtTime(fake, 0.3).output).toBeCloseTo(0.3, 15);
  });
});
