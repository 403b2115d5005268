import { describe, expect, it } from 'vitest';
import { unwrapDegrees, wrapDegrees } from '../../src/numeric/unwrap.js';

describe('unwrapDegrees', () => {
  it('removes the jump of a linearly falling phase (the delay e^{−jωT})', () => {
    const truth = Array.from({ length: 50 }, (_, i) => -20 * i);
    const wrapped = truth.map(wrapDegrees);
    const un = unwrapDegrees(wrapped);
    truth.forEach((t, i) => expect(un[i]).toBeCloseTo(t, 12));
  });
  it('wraps to (−180, 180]', () => {
    expect(wrapDegrees(180)).toBe(180);
    expect(wrapDegrees(-180)).toBe(180);
    expect(wrapDegrees(190)).toBe(-170);
    expect(wrapDegrees(-540.5)).toBeCloseTo(179.5, 12);
  });
});
