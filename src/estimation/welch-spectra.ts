import { detrendSegment } from './detrend-segment.js';
import { periodicHannWindow } from './periodic-hann-window.js';
import { realFftOfSize } from './real-fft.js';
import type { EstimationDetrend } from './types.js';

/** One-sided Welch-averaged spectra at bins k = 0..n/2, in units²/Hz. */
export interface WelchSpectra {
  /** Guu: input auto-spectral density. */
  input: Float64Array;
  /** Gyy: output auto-spectral density. */
  output: Float64Array;
  /** Gyu = E[conj(U)·Y]: cross-spectral density, real and imaginary parts. */
  crossRe: Float64Array;
  crossIm: Float64Array;
  segments: number;
}

export interface WelchOptions {
  sampleRate: number;
  segmentLength: number;
  overlapSamples: number;
  segments: number;
  detrend: EstimationDetrend;
}

/**
 * Welch's averaged, modified periodogram (P. D. Welch, IEEE Trans. Audio
 * Electroacoust. AU-15, 1967) of an input/output pair: the records are cut
 * into `segments` overlapping segments, each detrended, tapered with the
 * periodic Hann window and transformed; |U|², |Y|² and conj(U)·Y are averaged
 * over segments. Scaling is the one-sided density 2/(fs·Σw²) (DC and Nyquist
 * bins once), the same as scipy.signal.welch / csd with scaling='density', so
 * Guu integrates to the input's variance.
 *
 * Cost: two real FFTs per segment; all buffers are allocated once per call.
 */
export function welchSpectra(input: ArrayLike<number>, output: ArrayLike<number>, options: WelchOptions): WelchSpectra {
  const { sampleRate, segmentLength: n, overlapSamples, segments, detrend } = options;
  const bins = n / 2 + 1;
  const step = n - overlapSamples;
  const { window, sumOfSquares } = periodicHannWindow(n);
  const fft = realFftOfSize(n);

  const segU = new Float64Array(n);
  const segY = new Float64Array(n);
  const specU = new Float64Array(2 * n);
  const specY = new Float64Array(2 * n);
  const guu = new Float64Array(bins);
  const gyy = new Float64Array(bins);
  const gyuRe = new Float64Array(bins);
  const gyuIm = new Float64Array(bins);

  for (let s = 0; s < segments; s++) {
    const start = s * step;
    for (let i = 0; i < n; i++) {
      segU[i] = input[start + i];
      segY[i] = output[start + i];
    }
    detrendSegment(segU, detrend);
    detrendSegment(segY, detrend);
    for (let i = 0; i < n; i++) {
      segU[i] *= window[i];
      segY[i] *= window[i];
    }
    fft.transform(segU, specU);
    fft.transform(segY, specY);
    for (let k = 0; k < bins; k++) {
      const ur = specU[2 * k];
      const ui = specU[2 * k + 1];
      const yr = specY[2 * k];
      const yi = specY[2 * k + 1];
      guu[k] += ur * ur + ui * ui;
      gyy[k] += yr * yr + yi * yi;
      gyuRe[k] += ur * yr + ui * yi;
      gyuIm[k] += ur * yi - ui * yr;
    }
  }

  const twoSided = 1 / (segments * sampleRate * sumOfSquares);
  for (let k = 0; k < bins; k++) {
    const scale = k === 0 || k === bins - 1 ? twoSided : 2 * twoSided;
    guu[k] *= scale;
    gyy[k] *= scale;
    gyuRe[k] *= scale;
    gyuIm[k] *= scale;
  }
  return { input: guu, output: gyy, crossRe: gyuRe, crossIm: gyuIm, segments };
}
