import { describe, expect, it } from 'vitest';
import { normaliseLoopInput } from '../../../src/analysis/time-response/normalise-loop-input.js';
import { TimeResponseInputError } from '../../../src/analysis/time-response/time-response-input-error.js';

const ok = { plant: { numerator: [0, 2], denominator: [0, 4, 2], delay: 0.1 }, controller: { numerator: [1], denominator: [1] } };

function codeOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e instanceof TimeResponseInputError) return `${e.code} ${e.path}`;
    throw e;
  }
  return 'no error';
}

describe('normaliseLoopInput', () => {
  it('drops leading zeros and makes the denominator monic', () => {
    const n = normaliseLoopInput(ok);
    expect(n.plant).toEqual({ numerator: [0.5], denominator: [1, 0.5] });
    expect(n.points).toBe(1000);
    expect(n.duration).toBeNull();
  });
  it('names the offending field', () => {
    expect(codeOf(() => normaliseLoopInput({ ...ok, plant: { ...ok.plant, denominator: [0, 0] } }))).toBe('ZERO_DENOMINATOR plant.denominator');
    expect(codeOf(() => normaliseLoopInput({ ...ok, controller: { numerator: [1, 0], denominator: [1] } }))).toBe(
      'IMPROPER_TRANSFER_FUNCTION controller.numerator',
    );
    expect(codeOf(() => normaliseLoopInput({ ...ok, plant: { ...ok.plant, numerator: [NaN] } }))).toBe('NON_FINITE_NUMBER plant.numerator.0');
    expect(codeOf(() => normaliseLoopInput({ ...ok, plant: { ...ok.plant, delay: -1 } }))).toBe('INVALID_DELAY plant.delay');
    expect(codeOf(() => normaliseLoopInput({ ...ok, duration: 0 }))).toBe('INVALID_DURATION duration');
    expect(codeOf(() => normaliseLoopInput({ ...ok, points: 1.5 }))).toBe('INVALID_POINTS points');
    expect(codeOf(() => normaliseLoopInput({ ...ok, controller: { numerator: [], denominator: [1] } }))).toBe(
      'EMPTY_COEFFICIENTS controller.numerator',
    );
  });
});
