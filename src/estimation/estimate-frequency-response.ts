import { EstimationInputError } from './estimation-input-error.js';
import { resolveEstimateSettings } from './resolve-estimate-settings.js';
import type { FrequencyResponseEstimate, FrequencyResponseEstimateRequest } from './types.js';
import { unwrapBinPhases } from './unwrap-bin-phases.js';
import { welchSpectra } from './welch-spectra.js';

/**
 * Frequency response of a plant from an input/output record pair, by the H1
 * estimator H1 = Gyu/Guu and the magnitude-squared coherence
 * γ² = |Gyu|²/(Guu·Gyy) (J. S. Bendat, A. G. Piersol, Random Data, 4th ed.,
 * Wiley 2010), with the spectra averaged over overlapping, Hann-tapered
 * segments after Welch (P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15,
 * 1967). H1 is unbiased by noise on the output; noise on the measured input
 * biases |H1| low. Coherence near 1 says the output is linearly explained by
 * the input at that frequency; random errors follow `h1RandomError`.
 *
 * Bins run from 0 to the Nyquist frequency in steps of 2π·fs/n rad/s; the
 * `plant` leaves out the DC bin (its phase is 0° or 180° by construction,
 * and with the mean removed it is mostly leakage).
 *
 * Throws `EstimationInputError` for requests it cannot estimate from.
 *
 * @example
 * const est = estimateFrequencyResponse({ sampleRate: 100, input: u, output: y });
 * // est.plant can be posted as the plant of /v1/analyses
 */
export function estimateFrequencyResponse(request: FrequencyResponseEstimateRequest): FrequencyResponseEstimate {
  const settings = resolveEstimateSettings(request);
  const { sampleRate, segmentLength, overlapSamples, segments, window, detrend } = settings;
  const spectra = welchSpectra(settings.input, settings.output, settings);
  const bins = segmentLength / 2 + 1;
  const binSpacing = (2 * Math.PI * sampleRate) / segmentLength;

  const frequency = new Array<number>(bins);
  const magnitude = new Array<number>(bins);
  const coherence = new Array<number>(bins);
  const h1Re = new Float64Array(bins);
  const h1Im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    const guu = spectra.input[k];
    const gyy = spectra.output[k];
    if (!(guu > 0)) throw noPower('input', k * binSpacing);
    if (!(gyy > 0)) throw noPower('output', k * binSpacing);
    const re = spectra.crossRe[k];
    const im = spectra.crossIm[k];
    h1Re[k] = re / guu;
    h1Im[k] = im / guu;
    frequency[k] = k * binSpacing;
    magnitude[k] = Math.hypot(re, im) / guu;
    // |Gyu|² ≤ Guu·Gyy (Cauchy–Schwarz); the clamp only removes rounding above 1.
    coherence[k] = Math.min(1, (re * re + im * im) / guu / gyy);
  }
  const phase = Array.from(unwrapBinPhases(h1Re, h1Im));

  return {
    frequency,
    magnitude,
    phase,
    coherence,
    inputSpectralDensity: Array.from(spectra.input),
    outputSpectralDensity: Array.from(spectra.output),
    segments,
    segmentLength,
    overlapSamples,
    sampleRate,
    window,
    detrend,
    plant: {
      kind: 'frequency-response',
      frequency: frequency.slice(1),
      magnitude: magnitude.slice(1),
      phase: phase.slice(1),
      coherence: coherence.slice(1),
      averages: segments,
    },
  };
}

function noPower(channel: 'input' | 'output', omega: number): EstimationInputError {
  const what =
    channel === 'input'
      ? 'H1 = Gyu/Guu is undefined there; the input must excite every frequency up to Nyquist'
      : 'coherence is undefined there; check that the output record is the measured response';
  return new EstimationInputError(
    channel === 'input' ? 'input_without_power' : 'output_without_power',
    [channel],
    `The ${channel} record has no power at ${omega.toPrecision(6)} rad/s after detrending and tapering, so ${what}.`,
  );
}
