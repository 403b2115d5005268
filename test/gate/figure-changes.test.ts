import { describe, expect, it } from 'vitest';
import { FIGURES } from '../../src/contract/schemas/comparisons.js';
import { figureChanges } from '../../src/gate/figure-changes.js';

const summary = (gmDb: number | null, pm: number, ms: number) => ({
  margins: {
    gain: gmDb === null ? null : { ratio: Math.pow(10, gmDb / 20), db: gmDb, frequency: 2 },
    phase: { degrees: pm, frequency: 0.5 },
    delay: { seconds: (pm * Math.PI) / 180 / 0.5, frequency: 0.5 },
    gainCrossovers: [],
    phaseCrossovers: [],
  },
  peaks: { sensitivity: { value: ms, db: 20 * Math.log10(ms), frequency: 1 }, complementarySensitivity: { value: 1.1, db: 0.83, frequency: 0.4 } },
  bandwidth: { closedLoop: 0.8, sensitivity: 0.3, crossover: 0.5 },
});

describe('figureChanges', () => {
  it('gives candidate − baseline for every figure', () => {
    const c = figureChanges(summary(10, 60, 1.5), summary(7, 45, 1.8));
    expect(Object.keys(c)).toEqual([...FIGURES]);
    expect(c.gainMarginDb).toEqual({ baseline: 10, candidate: 7, change: -3 });
    expect(c.phaseMarginDegrees.change).toBe(-15);
    expect(c.sensitivityPeak.change).toBeCloseTo(0.3, 15);
    expect(c.crossoverFrequency.change).toBe(0);
  });

  it('is null where a figure exists on one side only', () => {
    const c = figureChanges(summary(null, 60, 1.5), summary(7, 60, 1.5));
    expect(c.gainMarginDb).toEqual({ baseline: null, candidate: 7, change: null });
    expect(c.phaseCrossoverFrequency).toEqual({ baseline: null, candidate: 2, change: null });
  });
});
