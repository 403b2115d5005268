/**
 * The band a sampled loop is examined on: from well below its slowest
 * dynamics up to the Nyquist frequency π/Ts, where the unit circle closes
 * (the response above it repeats the one below, mirrored).
 *
 * Low end: three decades below the lowest characteristic frequency (the
 * continuous equivalents |ln z|/Ts of poles and zeros and, with m
 * integrators, where the asymptote |K0|/ω^m reaches 1), and at least four
 * decades below π/Ts.
 */
import type { FrequencyModel } from '../../model/frequency-model.js';

export interface SampledBand {
  min: number;
  /** π/Ts */
  max: number;
}

export function chooseSampledBand(loop: FrequencyModel, samplePeriod: number): SampledBand {
  const max = Math.PI / samplePeriod;
  const chars = loop.characteristicFrequencies.filter((w) => w > 0 && Number.isFinite(w));
  const m = loop.integrators;
  if (m > 0 && Number.isFinite(loop.lowFrequencyGain) && loop.lowFrequencyGain !== 0) {
    chars.push(Math.pow(Math.abs(loop.lowFrequencyGain), 1 / m));
  }
  const lowest = chars.length ? Math.min(...chars) : max;
  return { min: Math.min(lowest / 1e3, max * 1e-4), max };
}
