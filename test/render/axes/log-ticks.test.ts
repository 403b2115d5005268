import { describe, expect, it } from 'vitest';
import { logTicks } from '../../../src/render/axes/log-ticks.js';

describe('logTicks', () => {
  it('labels every decade and puts 2…9 × 10ⁿ as minors', () => {
    const t = logTicks(1e-3, 10);
    expect(t.major).toEqual([1e-3, 1e-2, 0.1, 1, 10]);
    expect(t.minor).toContain(0.002);
    expect(t.minor).toContain(9);
    expect(t.minor.length).toBe(4 * 8);
  });

  it('labels 2 and 5 as well on a short axis', () => {
    const t = logTicks(1, 100);
    expect(t.major).toEqual([1, 2, 5, 10, 20, 50, 100]);
  });

  it('labels every second decade when there are many', () => {
    const t = logTicks(1e-6, 1e6);
    expect(t.major).toEqual([1e-6, 1e-4, 1e-2, 1, 1e2, 1e4, 1e6]);
    expect(t.minor).toContain(1e-5);
  });

  it('widens to whole decades and refuses a non-positive range', () => {
    const t = logTicks(0.03, 470);
    expect(t.lo).toBe(0.01);
    expect(t.hi).toBe(1000);
    expect(() => logTicks(0, 1)).toThrow(RangeError);
  });
});
