import { describe, expect, it } from 'vitest';
import { linearTicks, niceStep } from '../../../src/render/axes/linear-ticks.js';

// Expected steps follow Heckbert's rule (Graphics Gems, 1990): the step is 1, 2, 5 or 10 × 10ⁿ.
describe('linearTicks', () => {
  it('picks 1-2-5 steps', () => {
    expect(niceStep(10, 5)).toBe(2);
    expect(niceStep(0.9, 5)).toBe(0.2);
    expect(niceStep(73, 5)).toBe(20);
    expect(niceStep(3, 6)).toBe(0.5);
  });

  it('widens the limits outward to whole steps and lists every tick', () => {
    const t = linearTicks(-0.13, 1.17, 5);
    expect(t.step).toBe(0.5);
    expect(t.lo).toBe(-0.5);
    expect(t.hi).toBe(1.5);
    expect(t.values).toEqual([-0.5, 0, 0.5, 1, 1.5]);
  });

  it('uses preferred steps for phase axes', () => {
    const t = linearTicks(-250, -90, 5, [15, 30, 45, 90, 180]);
    expect(t.step).toBe(45);
    expect(t.values[0]).toBe(-270);
    expect(t.values[t.values.length - 1]).toBe(-90);
  });

  it('writes ticks without binary noise', () => {
    expect(linearTicks(0, 0.3, 3).values).toEqual([0, 0.1, 0.2, 0.3]);
  });

  it('survives a degenerate range', () => {
    const t = linearTicks(1, 1);
    expect(t.lo).toBeLessThan(1);
    expect(t.hi).toBeGreaterThan(1);
  });
});
