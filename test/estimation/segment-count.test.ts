import { describe, expect, it } from 'vitest';
import { segmentCount } from '../../src/estimation/segment-count.js';
import { loadWelchFixture } from './support/welch-fixture.js';

describe('segmentCount', () => {
  it('matches the segment counts scipy.signal.spectrogram reports for the fixture cases', () => {
    const fixture = loadWelchFixture();
    for (const c of fixture.cases) {
      expect(segmentCount(fixture.input.length, c.segmentLength, c.overlapSamples), c.name).toBe(c.segments);
    }
  });

  it('leaves out a trailing partial segment and gives 0 when one segment does not fit', () => {
    expect(segmentCount(100, 32, 0)).toBe(3);
    expect(segmentCount(96, 32, 0)).toBe(3);
    expect(segmentCount(31, 32, 16)).toBe(0);
    expect(segmentCount(32, 32, 16)).toBe(1);
  });
});
