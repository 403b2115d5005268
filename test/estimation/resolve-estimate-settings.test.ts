import { describe, expect, it } from 'vitest';
import { EstimationInputError, ESTIMATION_ERROR_CODES } from '../../src/estimation/index.js';
import { resolveEstimateSettings } from '../../src/estimation/resolve-estimate-settings.js';
import type { FrequencyResponseEstimateRequest } from '../../src/estimation/types.js';

const ramp = (n: number) => Array.from({ length: n }, (_, i) => Math.sin(i * 0.37) + 0.01 * i);
const valid = (): FrequencyResponseEstimateRequest => ({ sampleRate: 50, input: ramp(4096), output: ramp(4096) });

function errorOf(request: unknown): EstimationInputError {
  try {
    resolveEstimateSettings(request as FrequencyResponseEstimateRequest);
  } catch (e) {
    expect(e).toBeInstanceOf(EstimationInputError);
    return e as EstimationInputError;
  }
  throw new Error('expected an EstimationInputError');
}

describe('resolveEstimateSettings defaults', () => {
  it('fills in Hann, mean removal, 50 % overlap and the default segment length', () => {
    const s = resolveEstimateSettings(valid());
    // 4096 samples: largest power of two n with 9n ≤ 2·4096 is 512 → ⌊8192/512⌋ − 1 = 15 segments.
    expect(s).toMatchObject({ window: 'hann', detrend: 'mean', segmentLength: 512, overlapSamples: 256, segments: 15 });
  });

  it('keeps explicit settings and rounds the overlap down to whole samples', () => {
    const s = resolveEstimateSettings({ ...valid(), segmentLength: 128, overlap: 0.3, detrend: 'linear' });
    // ⌊0.3·128⌋ = 38; segments ⌊(4096 − 38)/90⌋ = 45.
    expect(s).toMatchObject({ segmentLength: 128, overlapSamples: 38, segments: 45, detrend: 'linear' });
  });

  it('accepts overlap 0 and the largest overlap 0.9', () => {
    expect(resolveEstimateSettings({ ...valid(), overlap: 0 }).overlapSamples).toBe(0);
    expect(resolveEstimateSettings({ ...valid(), overlap: 0.9 }).overlapSamples).toBe(Math.floor(0.9 * 512));
  });
});

describe('resolveEstimateSettings errors: code, path and an actionable message', () => {
  const cases: [string, unknown, string, (string | number)[], RegExp][] = [
    ['zero sample rate', { ...valid(), sampleRate: 0 }, 'sample_rate_invalid', ['sampleRate'], /sampleRate/],
    ['NaN sample rate', { ...valid(), sampleRate: NaN }, 'sample_rate_invalid', ['sampleRate'], /finite/],
    ['unknown window', { ...valid(), window: 'flat' }, 'window_unknown', ['window'], /'hann'/],
    ['unknown detrend', { ...valid(), detrend: 'quadratic' }, 'detrend_unknown', ['detrend'], /'linear'/],
    ['negative overlap', { ...valid(), overlap: -0.1 }, 'overlap_invalid', ['overlap'], /between 0 and 0.9/],
    ['overlap 0.95', { ...valid(), overlap: 0.95 }, 'overlap_invalid', ['overlap'], /0.95/],
    ['segment length not a power of two', { ...valid(), segmentLength: 1000 }, 'segment_length_invalid', ['segmentLength'], /power of two/],
    ['segment length below 8', { ...valid(), segmentLength: 4 }, 'segment_length_invalid', ['segmentLength'], /from 8/],
    ['segment length not an integer', { ...valid(), segmentLength: 256.5 }, 'segment_length_invalid', ['segmentLength'], /256.5/],
    ['input not an array', { ...valid(), input: 'abc' }, 'record_invalid', ['input'], /array/],
    ['output missing', { sampleRate: 1, input: ramp(100) }, 'record_invalid', ['output'], /undefined/],
    ['lengths differ', { ...valid(), output: ramp(4095) }, 'record_lengths_differ', ['output'], /4096.*4095/],
    ['record too long', { sampleRate: 1, input: new Float64Array(2_000_001), output: new Float64Array(2_000_001) }, 'record_too_long', ['input'], /2000000/],
    ['record too short for two default segments', { sampleRate: 1, input: ramp(95), output: ramp(95) }, 'record_too_short', ['input'], /at least 96 samples/],
    ['empty records', { sampleRate: 1, input: [], output: [] }, 'record_too_short', ['input'], /0 samples/],
    ['explicit segment longer than half the record', { ...valid(), segmentLength: 4096 }, 'segment_length_too_long', ['segmentLength'], /shorter segmentLength/],
    ['NaN in input', { ...valid(), input: Object.assign(ramp(4096), { 17: NaN }) }, 'sample_not_finite', ['input', 17], /input\[17\] is NaN/],
    ['Infinity in output', { ...valid(), output: Object.assign(ramp(4096), { 4095: -Infinity }) }, 'sample_not_finite', ['output', 4095], /-Infinity/],
    ['null in output', { ...valid(), output: Object.assign(ramp(4096), { 3: null }) }, 'sample_not_finite', ['output', 3], /null/],
    ['string in input', { ...valid(), input: Object.assign(ramp(4096), { 0: '1.5' }) }, 'sample_not_finite', ['input', 0], /a string/],
  ];
  for (const [what, request, code, path, message] of cases) {
    it(what, () => {
      const e = errorOf(request);
      expect(e.code).toBe(code);
      expect(e.path).toEqual(path);
      expect(e.message).toMatch(message);
      expect(e.name).toBe('EstimationInputError');
      expect(ESTIMATION_ERROR_CODES[e.code]).toBeTypeOf('string');
    });
  }

  it('96 samples are exactly enough for two default segments of 64 at 50 % overlap', () => {
    expect(resolveEstimateSettings({ sampleRate: 1, input: ramp(96), output: ramp(96) }).segments).toBe(2);
  });
});
