import { describe, expect, it } from 'vitest';
import { defaultSegmentLength } from '../../src/estimation/index.js';
import { segmentCount } from '../../src/estimation/segment-count.js';

describe('defaultSegmentLength: largest power of two giving ≥ 8 segments at 50 % overlap, 64..65536', () => {
  it('16384 samples → 2048 (15 segments), as in the scipy fixture', () => {
    expect(defaultSegmentLength(16384)).toBe(2048);
  });

  it('switches exactly where ⌊2N/n⌋ − 1 reaches 8 (N = 9n/2)', () => {
    expect(defaultSegmentLength(9216)).toBe(2048);
    expect(defaultSegmentLength(9215)).toBe(1024);
    expect(segmentCount(9216, 2048, 1024)).toBe(8);
    expect(segmentCount(9215, 2048, 1024)).toBe(7);
  });

  it('every default between the clamps gives 8..16 segments (doubling n would give fewer than 8)', () => {
    for (let n = 300; n < 300_000; n = Math.ceil(n * 1.37)) {
      const len = defaultSegmentLength(n);
      const count = segmentCount(n, len, len / 2);
      expect(count, `N = ${n}`).toBeGreaterThanOrEqual(8);
      expect(segmentCount(n, 2 * len, len), `N = ${n}`).toBeLessThan(8);
    }
  });

  it('clamps to 64 for short records and to 65536 for long ones', () => {
    expect(defaultSegmentLength(100)).toBe(64);
    expect(defaultSegmentLength(287)).toBe(64);
    expect(defaultSegmentLength(288)).toBe(64);
    expect(defaultSegmentLength(576)).toBe(128);
    expect(defaultSegmentLength(2_000_000)).toBe(65536);
  });
});
