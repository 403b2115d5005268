/**
 * Sampling warnings at their thresholds: 2π/Ts against 10 × bandwidth (the
 * lower end of the 10–30 rule, Åström & Wittenmark, from memory), and
 * |C(e^{jπ})|/|kp| against 21 = 1 + N for N = 20, the top of the usual range
 * of the derivative filter (Åström & Hägglund, from memory).
 */
import { describe, expect, it } from 'vitest';
import { collectSamplingWarnings, MAX_NYQUIST_GAIN_RATIO, MIN_SAMPLES_PER_BANDWIDTH } from '../../../src/analysis/sampled/sampling-warnings.js';

const base = { samplePeriod: 0.1, bandwidth: null, nyquistGainRatio: null, nyquistGain: null, controllerUnstablePoles: 0, actuatorNoise: null };

describe('collectSamplingWarnings', () => {
  it('sample_rate_low just below ten samples per bandwidth, not just above', () => {
    const ws = (2 * Math.PI) / 0.1;
    const low = collectSamplingWarnings({ ...base, bandwidth: { frequency: ws / (MIN_SAMPLES_PER_BANDWIDTH * 0.99), what: 'x' } });
    expect(low.map((w) => w.code)).toEqual(['sample_rate_low']);
    expect(low[0].value).toBeCloseTo(9.9, 12);
    expect(collectSamplingWarnings({ ...base, bandwidth: { frequency: ws / (MIN_SAMPLES_PER_BANDWIDTH * 1.01), what: 'x' } })).toEqual([]);
  });

  it('controller_gain_high_at_nyquist above 21·|kp|, and for an infinite gain', () => {
    expect(collectSamplingWarnings({ ...base, nyquistGainRatio: MAX_NYQUIST_GAIN_RATIO * 1.01, nyquistGain: 5 }).map((w) => w.code)).toEqual(['controller_gain_high_at_nyquist']);
    expect(collectSamplingWarnings({ ...base, nyquistGainRatio: MAX_NYQUIST_GAIN_RATIO * 0.99, nyquistGain: 5 })).toEqual([]);
    const inf = collectSamplingWarnings({ ...base, nyquistGainRatio: Infinity, nyquistGain: Infinity });
    expect(inf[0].value).toBeNull();
    expect(inf[0].message).toMatch(/z = −1/);
  });

  it('discretised_controller_unstable and actuator_noise_high', () => {
    const w = collectSamplingWarnings({ ...base, controllerUnstablePoles: 1, actuatorNoise: { rms: 0.2, limit: 0.1 } });
    expect(w.map((x) => x.code)).toEqual(['discretised_controller_unstable', 'actuator_noise_high']);
    expect(collectSamplingWarnings({ ...base, actuatorNoise: { rms: 0.05, limit: 0.1 } })).toEqual([]);
  });
});
