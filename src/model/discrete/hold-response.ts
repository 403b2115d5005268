/**
 * Sampler and zero-order hold as one element of a continuous loop, with a
 * computation delay d: H(jω) = (1 − e^{−jωTs})/(jωTs)·e^{−jωd}
 * = sinc(ωTs/2)·e^{−jω(Ts/2 + d)} (derivation: the hold's impulse response is
 * a pulse of width Ts, the sampler contributes 1/Ts). Unit gain at ω = 0,
 * zeros at multiples of the sample rate 2π/Ts.
 *
 * C(e^{jωTs})·H(jω)·P(jω) is the sampled loop without aliasing: exact only
 * when P(jω) is negligible above the Nyquist frequency π/Ts. It serves plants
 * with no rational model (measured data, expressions in s), which cannot be
 * sampled exactly.
 */
import type { FrequencyModel } from '../frequency-model.js';

export function holdResponseModel(samplePeriod: number, computationDelay = 0): FrequencyModel {
  const ts = samplePeriod;
  const lag = ts / 2 + computationDelay;
  return {
    evaluate(omega, out) {
      const x = (omega * ts) / 2;
      const sinc = x === 0 ? 1 : Math.sin(x) / x;
      out.re = sinc * Math.cos(omega * lag);
      out.im = -sinc * Math.sin(omega * lag);
      return out;
    },
    rational: null,
    poles: [],
    zeros: null,
    delay: lag,
    phaseRate: lag,
    integrators: 0,
    imaginaryAxisPoles: [],
    unstablePoles: 0,
    unstablePolesAssumed: false,
    relativeDegree: null,
    highFrequencyGain: NaN,
    lowFrequencyGain: 1,
    characteristicFrequencies: [Math.PI / ts],
    // |sinc(x)| ≤ min(1, 1/x), nonincreasing as a bound.
    magnitudeBoundAbove: (omega) => Math.min(1, 2 / (omega * ts)),
    deviationBoundAbove: (omega) => Math.min(1, 2 / (omega * ts)),
    exact: true,
  };
}
