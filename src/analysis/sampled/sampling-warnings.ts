/**
 * Warnings that only a sampled implementation raises: a sample rate too low
 * for the loop's bandwidth, a controller whose gain at the Nyquist frequency
 * turns A/D noise into actuator noise, a discretisation that made the
 * controller itself unstable, and (with a limit given) too much actuator
 * noise from quantisation.
 */
import type { Warning } from '../warnings.js';

export const SAMPLING_WARNING_CODES = {
  sampleRateLow: 'sample_rate_low',
  controllerGainHighAtNyquist: 'controller_gain_high_at_nyquist',
  discretisedControllerUnstable: 'discretised_controller_unstable',
  actuatorNoiseHigh: 'actuator_noise_high',
} as const;

/** Sample at least this many times faster than the closed-loop bandwidth (lower end of 10–30). */
export const MIN_SAMPLES_PER_BANDWIDTH = 10;
/**
 * Largest |C(e^{jπ})|/|kp| before a warning: a derivative filtered with N at
 * the top of its usual range 5–20 gives a high-frequency gain of about
 * K·(1 + N) = 21·K.
 */
export const MAX_NYQUIST_GAIN_RATIO = 21;

const SAMPLE_RATE_SOURCE =
  'Åström & Wittenmark, Computer-Controlled Systems, 3rd ed.: sample roughly 10–30 times faster than the closed-loop bandwidth (common practice, from memory)';

export interface SamplingWarningInputs {
  samplePeriod: number;
  /** Closed-loop bandwidth (or crossover when none) the sample rate is judged against, rad/s. */
  bandwidth: { frequency: number; what: string } | null;
  /** |C(e^{jπ})| relative to |kp|; Infinity for a pole at z = −1; null when kp = 0 or no controller. */
  nyquistGainRatio: number | null;
  /** |C(e^{jπ})|, Infinity for a pole at z = −1. */
  nyquistGain: number | null;
  controllerUnstablePoles: number;
  actuatorNoise: { rms: number; limit: number } | null;
}

export function collectSamplingWarnings(x: SamplingWarningInputs): Warning[] {
  const out: Warning[] = [];
  const ws = (2 * Math.PI) / x.samplePeriod;
  if (x.bandwidth && x.bandwidth.frequency > 0) {
    const ratio = ws / x.bandwidth.frequency;
    if (ratio < MIN_SAMPLES_PER_BANDWIDTH) {
      out.push({
        code: SAMPLING_WARNING_CODES.sampleRateLow,
        message: `The sample rate 2π/Ts = ${ws.toPrecision(4)} rad/s is only ${ratio.toFixed(2)} times the ${x.bandwidth.what} (${x.bandwidth.frequency.toPrecision(4)} rad/s, ${(x.bandwidth.frequency * x.samplePeriod).toFixed(3)} rad per sample); the hold and the discretisation eat phase margin. Sample at least ${MIN_SAMPLES_PER_BANDWIDTH} times faster.`,
        value: ratio,
        limit: MIN_SAMPLES_PER_BANDWIDTH,
        source: SAMPLE_RATE_SOURCE,
      });
    }
  }
  if (x.nyquistGainRatio !== null && x.nyquistGainRatio > MAX_NYQUIST_GAIN_RATIO) {
    const infinite = !Number.isFinite(x.nyquistGainRatio);
    out.push({
      code: SAMPLING_WARNING_CODES.controllerGainHighAtNyquist,
      message: infinite
        ? 'The discretised controller has a pole at z = −1 (Tustin applied to an unfiltered derivative): its gain at the Nyquist frequency is infinite and its output rings from sample to sample. Filter the derivative.'
        : `The controller's gain at the Nyquist frequency, |C| = ${x.nyquistGain!.toPrecision(4)}, is ${x.nyquistGainRatio.toFixed(1)} times its proportional gain: A/D quantisation and measurement noise reach the actuator amplified. Filter the derivative more (smaller N) or sample more slowly.`,
      value: infinite ? null : x.nyquistGainRatio,
      limit: MAX_NYQUIST_GAIN_RATIO,
      source: 'Åström & Hägglund, Advanced PID Control, ISA 2006, §3.3: derivative filter N typically 5–20, high-frequency gain K(1 + N) (from memory)',
    });
  }
  if (x.controllerUnstablePoles > 0) {
    out.push({
      code: SAMPLING_WARNING_CODES.discretisedControllerUnstable,
      message: `The discretised controller has ${x.controllerUnstablePoles} pole(s) outside the unit circle (forward Euler with Ts above twice the derivative filter time constant does this): it is unstable on its own. Use backward-euler or tustin.`,
      value: x.controllerUnstablePoles,
      limit: 0,
      source: 'Åström & Wittenmark, Computer-Controlled Systems, 3rd ed., §8.2 (forward differences map stable poles outside the unit circle)',
    });
  }
  if (x.actuatorNoise && x.actuatorNoise.rms > x.actuatorNoise.limit) {
    out.push({
      code: SAMPLING_WARNING_CODES.actuatorNoiseHigh,
      message: `Quantisation noise gives an actuator noise of ${x.actuatorNoise.rms.toPrecision(4)} RMS, above the limit ${x.actuatorNoise.limit}.`,
      value: x.actuatorNoise.rms,
      limit: x.actuatorNoise.limit,
      source: 'uniform quantisation noise of variance q²/12 through C·S (common practice)',
    });
  }
  return out;
}
