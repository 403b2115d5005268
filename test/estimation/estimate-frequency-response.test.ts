import { describe, expect, it } from 'vitest';
import { EstimationInputError, estimateFrequencyResponse, h1RandomError } from '../../src/estimation/index.js';
import { gaussianRecord } from './support/seeded-noise.js';
import { loadWelchFixture, maxRelativeDifference } from './support/welch-fixture.js';

const fixture = loadWelchFixture();

function estimateCase(name: string) {
  const c = fixture.cases.find((x) => x.name === name);
  if (!c) throw new Error(`fixture case ${name} missing`);
  const estimate = estimateFrequencyResponse({
    sampleRate: fixture.sampleRate,
    input: fixture.input,
    output: fixture.output,
    ...c.request,
  });
  return { c, estimate };
}

describe('estimateFrequencyResponse against scipy.signal (welch, csd, coherence)', () => {
  // Expected values: scipy.signal.welch/csd/coherence on the same stored samples,
  // periodic Hann, scaling='density' (scripts/fixtures/make_estimation_reference.py).
  // Both sides are double precision on identical data; 1e-9 relative leaves room
  // only for FFT rounding (fft.js vs pocketfft).
  for (const c of fixture.cases) {
    it(`matches scipy ${fixture.scipyVersion} to 1e-9 relative: case ${c.name}`, () => {
      const { estimate } = estimateCase(c.name);
      expect(estimate.segmentLength).toBe(c.segmentLength);
      expect(estimate.overlapSamples).toBe(c.overlapSamples);
      expect(estimate.segments).toBe(c.segments);
      const omega = c.frequencyHz.map((f) => 2 * Math.PI * f);
      expect(maxRelativeDifference(estimate.frequency, omega, 1)).toBeLessThan(1e-12);
      expect(maxRelativeDifference(estimate.inputSpectralDensity, c.inputSpectralDensity)).toBeLessThan(1e-9);
      expect(maxRelativeDifference(estimate.outputSpectralDensity, c.outputSpectralDensity)).toBeLessThan(1e-9);
      expect(maxRelativeDifference(estimate.magnitude, c.magnitude)).toBeLessThan(1e-9);
      expect(maxRelativeDifference(estimate.coherence, c.coherence)).toBeLessThan(1e-9);
      // Phase near 0° has no useful relative scale: compare to 1e-9 of max(|φ|, 1°).
      expect(maxRelativeDifference(estimate.phase, c.phaseDeg, 1)).toBeLessThan(1e-9);
    });
  }

  it('the four cases differ from one another, so each setting is really exercised', () => {
    const coherenceAt = (name: string, bin: number) => estimateCase(name).estimate.coherence[bin];
    // Same resolution (2048), different detrending: low bins differ because of the output drift.
    expect(Math.abs(coherenceAt('defaults', 1) - coherenceAt('linear-2048', 1))).toBeGreaterThan(1e-3);
  });
});

describe('estimateFrequencyResponse against the true system (scipy.signal.freqz)', () => {
  const { c, estimate } = estimateCase('linear-2048');
  const trueMagnitude = c.trueMagnitude!;
  const truePhase = c.truePhaseDeg!;
  const nd = estimate.segments;
  // Bins where the estimate is trustworthy (coherence > 0.9), DC left out.
  const bins = estimate.coherence.map((g, k) => (k > 0 && g > 0.9 ? k : -1)).filter((k) => k >= 0);

  // Tolerance: the random error of H1, ε = √(1−γ²)/(|γ|√(2nd)) for |H| and the
  // same in radians for the phase (Bendat & Piersol, Random Data, 4th ed.,
  // from memory), evaluated with the estimated coherence. ε is a standard
  // deviation; about 480 bins are checked at once and at nd = 15 the H1 error
  // (a quotient with a Gamma-distributed denominator) has heavier tails than a
  // Gaussian, so each bin gets a 6ε band. The band is 1 %–18 % wide: a wrong
  // scaling, a conjugated cross spectrum or missing averaging fail it.
  const k = 6;

  it('has enough high-coherence bins to say something', () => {
    expect(bins.length).toBeGreaterThan(300);
  });

  it('|H1| is within 6ε of |H| wherever coherence > 0.9', () => {
    for (const b of bins) {
      const eps = h1RandomError(estimate.coherence[b], nd).magnitudeRelative;
      expect(Math.abs(estimate.magnitude[b] / trueMagnitude[b] - 1), `bin ${b}`).toBeLessThan(k * eps);
    }
  });

  it('phase of H1 is within 6ε rad of the true phase wherever coherence > 0.9', () => {
    for (const b of bins) {
      const eps = h1RandomError(estimate.coherence[b], nd).phaseStdRad;
      const error = ((estimate.phase[b] - truePhase[b]) * Math.PI) / 180;
      expect(Math.abs(error), `bin ${b}`).toBeLessThan(k * eps);
    }
  });

  it('the errors are spread like the Bendat & Piersol standard deviation (rms of error/ε between 0.7 and 1.6)', () => {
    // Expected about 1; somewhat above because overlapping segments are not fully
    // independent (Welch 1967) and nd − 1 rather than nd enters for finite nd.
    let sum = 0;
    for (const b of bins) {
      const eps = h1RandomError(estimate.coherence[b], nd).magnitudeRelative;
      sum += (estimate.magnitude[b] / trueMagnitude[b] - 1) ** 2 / eps ** 2;
    }
    const rms = Math.sqrt(sum / bins.length);
    expect(rms).toBeGreaterThan(0.7);
    expect(rms).toBeLessThan(1.6);
  });
});

describe('estimateFrequencyResponse response shape', () => {
  const { estimate } = estimateCase('defaults');

  it('runs from 0 rad/s to the Nyquist frequency π·fs in steps of 2π·fs/n', () => {
    const n = estimate.segmentLength;
    expect(estimate.frequency.length).toBe(n / 2 + 1);
    expect(estimate.frequency[0]).toBe(0);
    expect(estimate.frequency.at(-1)).toBeCloseTo(Math.PI * fixture.sampleRate, 12);
    expect(estimate.frequency[1]).toBeCloseTo((2 * Math.PI * fixture.sampleRate) / n, 12);
  });

  it('reports the defaults it used: Hann, mean removal, 50 % overlap', () => {
    expect(estimate.window).toBe('hann');
    expect(estimate.detrend).toBe('mean');
    expect(estimate.overlapSamples).toBe(estimate.segmentLength / 2);
    expect(estimate.sampleRate).toBe(fixture.sampleRate);
  });

  it('gives a ready-to-post frequency-response plant without the DC bin', () => {
    const { plant } = estimate;
    expect(plant.kind).toBe('frequency-response');
    expect(plant.frequency).toEqual(estimate.frequency.slice(1));
    expect(plant.magnitude).toEqual(estimate.magnitude.slice(1));
    expect(plant.phase).toEqual(estimate.phase.slice(1));
    expect(plant.coherence).toEqual(estimate.coherence.slice(1));
    expect(plant.frequency[0]).toBeGreaterThan(0);
    // Plain arrays, so JSON.stringify gives arrays (a Float64Array would become an object).
    expect(JSON.parse(JSON.stringify(plant)).frequency).toEqual(plant.frequency);
  });

  it('starts the phase on the principal branch (the fixture plant is a low-pass with 0° at DC)', () => {
    expect(Math.abs(estimate.phase[1])).toBeLessThan(180);
  });

  it('accepts Float64Array records and gives the same estimate', () => {
    const typed = estimateFrequencyResponse({
      sampleRate: fixture.sampleRate,
      input: Float64Array.from(fixture.input),
      output: Float64Array.from(fixture.output),
    });
    expect(typed.magnitude).toEqual(estimate.magnitude);
  });
});

describe('estimateFrequencyResponse on records without power in a bin', () => {
  it('rejects an input that is constant (nothing left after removing the mean)', () => {
    const input = new Array(1024).fill(3);
    const output = Array.from(gaussianRecord(1024, 5));
    expect(() => estimateFrequencyResponse({ sampleRate: 10, input, output })).toThrow(
      expect.objectContaining({ name: 'EstimationInputError', code: 'input_without_power', path: ['input'] }),
    );
  });

  it('rejects an all-zero output', () => {
    const input = Array.from(gaussianRecord(1024, 6));
    const output = new Array(1024).fill(0);
    expect(() => estimateFrequencyResponse({ sampleRate: 10, input, output })).toThrow(EstimationInputError);
    try {
      estimateFrequencyResponse({ sampleRate: 10, input, output });
    } catch (e) {
      expect((e as EstimationInputError).code).toBe('output_without_power');
      expect((e as EstimationInputError).message).toMatch(/rad\/s/);
    }
  });
});

describe('estimateFrequencyResponse on a long record (performance sanity, no timing assertion)', () => {
  it('estimates a 1,000,000-sample record of the two-tap average y[i] = (u[i] + u[i−1])/2', () => {
    // Closed form: H(e^{jθ}) = (1 + e^{−jθ})/2 = cos(θ/2)·e^{−jθ/2}, θ = ω/fs.
    const length = 1_000_000;
    const fs = 1000;
    const u = gaussianRecord(length, 20240611);
    const y = new Float64Array(length);
    y[0] = u[0] / 2;
    for (let i = 1; i < length; i++) y[i] = (u[i] + u[i - 1]) / 2;

    const estimate = estimateFrequencyResponse({ sampleRate: fs, input: u, output: y });
    // Default: largest power of two with ≥ 8 segments is capped at 65536, giving ⌊2N/n⌋ − 1 = 29.
    expect(estimate.segmentLength).toBe(65536);
    expect(estimate.segments).toBe(29);
    expect(estimate.frequency.length).toBe(32769);

    let worst = 0;
    for (let b = 1; b < estimate.frequency.length; b++) {
      const theta = estimate.frequency[b] / fs;
      const re = Math.cos(theta / 2) * Math.cos(theta / 2);
      const im = -Math.cos(theta / 2) * Math.sin(theta / 2);
      const phase = (estimate.phase[b] * Math.PI) / 180;
      const dre = estimate.magnitude[b] * Math.cos(phase) - re;
      const dim = estimate.magnitude[b] * Math.sin(phase) - im;
      worst = Math.max(worst, Math.hypot(dre, dim));
    }
    // Noise-free: only the segment-edge effect of the one-sample memory remains, O(1/n).
    expect(worst).toBeLessThan(1e-3);
    // Phase falls linearly, −θ/2: −67.5° at three quarters of Nyquist, and
    // unwrapping kept it on one branch throughout (no whole turns added).
    expect(estimate.phase[(3 * estimate.segmentLength) / 8]).toBeCloseTo(-67.5, 3);
    // (Loose bounds: next to Nyquist |H| → 0 and the O(1/n) edge error dominates the phase.)
    const belowNyquist = estimate.phase.slice(1, -1);
    expect(Math.min(...belowNyquist)).toBeGreaterThan(-180);
    expect(Math.max(...belowNyquist)).toBeLessThan(90);
  });
});
