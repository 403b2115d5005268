import { defaultSegmentLength } from './default-segment-length.js';
import { EstimationInputError } from './estimation-input-error.js';
import {
  DEFAULT_OVERLAP,
  MAX_OVERLAP,
  MAX_RECORD_SAMPLES,
  MAX_SEGMENT_LENGTH,
  MIN_SEGMENTS,
  MIN_SEGMENT_LENGTH,
} from './limits.js';
import { segmentCount } from './segment-count.js';
import type { EstimationDetrend, EstimationWindow, FrequencyResponseEstimateRequest } from './types.js';

/** The request after checks, with every default filled in. */
export interface EstimateSettings {
  sampleRate: number;
  input: ArrayLike<number>;
  output: ArrayLike<number>;
  recordLength: number;
  segmentLength: number;
  overlapSamples: number;
  segments: number;
  window: EstimationWindow;
  detrend: EstimationDetrend;
}

const DETRENDS: readonly EstimationDetrend[] = ['mean', 'linear', 'none'];
const WINDOWS: readonly EstimationWindow[] = ['hann'];

/**
 * Checks an estimation request and fills in its defaults. Throws
 * `EstimationInputError` with the first problem found; checks run in the
 * order a person would fix them (settings, then record shapes, then samples).
 */
export function resolveEstimateSettings(request: FrequencyResponseEstimateRequest): EstimateSettings {
  const { sampleRate } = request;
  if (typeof sampleRate !== 'number' || !Number.isFinite(sampleRate) || sampleRate <= 0) {
    throw new EstimationInputError(
      'sample_rate_invalid',
      ['sampleRate'],
      `sampleRate must be a finite number of samples per second above 0; got ${String(sampleRate)}.`,
    );
  }

  const window = request.window ?? 'hann';
  if (!WINDOWS.includes(window)) {
    throw new EstimationInputError(
      'window_unknown',
      ['window'],
      `window must be one of ${WINDOWS.map((w) => `'${w}'`).join(', ')}; got ${JSON.stringify(window)}.`,
    );
  }
  const detrend = request.detrend ?? 'mean';
  if (!DETRENDS.includes(detrend)) {
    throw new EstimationInputError(
      'detrend_unknown',
      ['detrend'],
      `detrend must be one of ${DETRENDS.map((d) => `'${d}'`).join(', ')}; got ${JSON.stringify(detrend)}.`,
    );
  }

  const overlap = request.overlap ?? DEFAULT_OVERLAP;
  if (typeof overlap !== 'number' || !Number.isFinite(overlap) || overlap < 0 || overlap > MAX_OVERLAP) {
    throw new EstimationInputError(
      'overlap_invalid',
      ['overlap'],
      `overlap must be a fraction of a segment between 0 and ${MAX_OVERLAP}; got ${String(overlap)}.`,
    );
  }

  const requestedLength = request.segmentLength;
  if (requestedLength !== undefined && !isAllowedSegmentLength(requestedLength)) {
    throw new EstimationInputError(
      'segment_length_invalid',
      ['segmentLength'],
      `segmentLength must be a power of two from ${MIN_SEGMENT_LENGTH} to ${MAX_SEGMENT_LENGTH}; got ${String(requestedLength)}.`,
    );
  }

  const { input, output } = request;
  checkRecordShape(input, 'input');
  checkRecordShape(output, 'output');
  if (output.length !== input.length) {
    throw new EstimationInputError(
      'record_lengths_differ',
      ['output'],
      `input and output must be sampled together: input has ${input.length} samples, output has ${output.length}.`,
    );
  }
  const recordLength = input.length;

  const segmentLength = requestedLength ?? defaultSegmentLength(recordLength);
  const overlapSamples = Math.floor(overlap * segmentLength);
  const segments = segmentCount(recordLength, segmentLength, overlapSamples);
  if (segments < MIN_SEGMENTS) {
    const step = segmentLength - overlapSamples;
    const needed = segmentLength + (MIN_SEGMENTS - 1) * step;
    if (requestedLength !== undefined) {
      throw new EstimationInputError(
        'segment_length_too_long',
        ['segmentLength'],
        `segmentLength ${segmentLength} with overlap ${overlap} gives ${segments} segment(s) from ${recordLength} samples; ` +
          `averaging needs at least ${MIN_SEGMENTS} (at least ${needed} samples), so choose a shorter segmentLength.`,
      );
    }
    throw new EstimationInputError(
      'record_too_short',
      ['input'],
      `${recordLength} samples are too few: an estimate averages at least ${MIN_SEGMENTS} segments of ` +
        `${segmentLength} samples with overlap ${overlap}, which needs at least ${needed} samples.`,
    );
  }

  checkSamplesFinite(input, 'input');
  checkSamplesFinite(output, 'output');

  return { sampleRate, input, output, recordLength, segmentLength, overlapSamples, segments, window, detrend };
}

function isAllowedSegmentLength(n: unknown): n is number {
  return (
    typeof n === 'number' &&
    Number.isInteger(n) &&
    n >= MIN_SEGMENT_LENGTH &&
    n <= MAX_SEGMENT_LENGTH &&
    (n & (n - 1)) === 0
  );
}

function checkRecordShape(record: unknown, name: 'input' | 'output'): asserts record is ArrayLike<number> {
  const isArray = Array.isArray(record) || record instanceof Float64Array || record instanceof Float32Array;
  if (!isArray) {
    throw new EstimationInputError(
      'record_invalid',
      [name],
      `${name} must be an array of samples (numbers); got ${record === null ? 'null' : typeof record}.`,
    );
  }
  const length = (record as ArrayLike<number>).length;
  if (length > MAX_RECORD_SAMPLES) {
    throw new EstimationInputError(
      'record_too_long',
      [name],
      `${name} has ${length} samples; at most ${MAX_RECORD_SAMPLES} are accepted per record (decimate or shorten it).`,
    );
  }
}

function checkSamplesFinite(record: ArrayLike<number>, name: 'input' | 'output'): void {
  for (let i = 0; i < record.length; i++) {
    const v = record[i];
    // typeof guards plain-JavaScript callers passing strings or nulls inside the array.
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new EstimationInputError(
        'sample_not_finite',
        [name, i],
        `${name}[${i}] is ${describeSample(v)}; every sample must be a finite number (fill or cut gaps before estimating).`,
      );
    }
  }
}

function describeSample(v: unknown): string {
  if (typeof v === 'number') return String(v);
  if (v === null) return 'null';
  return `a ${typeof v}`;
}
