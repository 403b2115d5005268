/** Request and response shapes of the frequency-response estimate. */

export type EstimationWindow = 'hann';
export type EstimationDetrend = 'mean' | 'linear' | 'none';

export interface FrequencyResponseEstimateRequest {
  /** Samples per second (Hz). */
  sampleRate: number;
  /** Excitation record u, equally spaced samples. */
  input: ArrayLike<number>;
  /** Measured response record y, same length and sampling as `input`. */
  output: ArrayLike<number>;
  /** Samples per segment, a power of two; default from the record length (see `defaultSegmentLength`). */
  segmentLength?: number;
  /** Fraction of a segment shared with the next one, 0 ≤ overlap ≤ 0.9; default 0.5. */
  overlap?: number;
  /** Taper applied to every segment; only the periodic Hann window for now. Default 'hann'. */
  window?: EstimationWindow;
  /** What is removed from each segment before tapering; default 'mean'. */
  detrend?: EstimationDetrend;
}

/** A measured plant in the form `/v1/analyses` accepts (the DC bin left out). */
export interface FrequencyResponsePlant {
  kind: 'frequency-response';
  /** rad/s, increasing, strictly positive. */
  frequency: number[];
  magnitude: number[];
  /** Degrees, unwrapped. */
  phase: number[];
  /** Magnitude-squared coherence, 0..1. */
  coherence: number[];
  /** Number of averaged segments, for the random-error band of the margins. */
  averages: number;
}

export interface FrequencyResponseEstimate {
  /** rad/s, bins k·2π·fs/n for k = 0..n/2 (zero up to the Nyquist frequency). */
  frequency: number[];
  /** |H1| at each bin. */
  magnitude: number[];
  /** Phase of H1 in degrees, unwrapped from the first non-DC bin (see `unwrapBinPhases`). */
  phase: number[];
  /** Magnitude-squared coherence γ² at each bin. */
  coherence: number[];
  /** One-sided power spectral density of the input, units²/Hz (same scaling as scipy.signal.welch, scaling='density'). */
  inputSpectralDensity: number[];
  /** One-sided power spectral density of the output, units²/Hz. */
  outputSpectralDensity: number[];
  /** Number of averaged segments nd (the `nd` of the random-error formula). */
  segments: number;
  segmentLength: number;
  /** Samples shared by neighbouring segments, ⌊overlap·segmentLength⌋. */
  overlapSamples: number;
  sampleRate: number;
  window: EstimationWindow;
  detrend: EstimationDetrend;
  /** The same estimate without the DC bin, ready to post as a plant. */
  plant: FrequencyResponsePlant;
}
