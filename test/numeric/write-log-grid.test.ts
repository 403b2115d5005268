import { describe, expect, it } from 'vitest';
import { logGrid } from '../../src/numeric/log-grid.js';
import { logStep, writeLogGrid } from '../../src/numeric/write-log-grid.js';

describe('logStep and the log grids', () => {
  it('within range the step is the plain ratio, so every grid keeps its exact values', () => {
    expect(logStep(1e-3, 1e3, 61)).toBe(Math.pow(1e6, 1 / 60));
    const out = new Float64Array(61);
    writeLogGrid(out, 0, 1e-3, 1e3, 61);
    expect(Array.from(out)).toEqual(Array.from(logGrid(1e-3, 1e3, 61)));
  });

  it('a span whose ratio overflows (1e-290 to 1e290) is stepped through logarithms: finite, increasing, ends exact', () => {
    expect(Number.isFinite(1e290 / 1e-290)).toBe(false);
    const g = logGrid(1e-290, 1e290, 581);
    expect(g[0]).toBe(1e-290);
    expect(g[580]).toBe(1e290);
    for (let i = 1; i < g.length; i++) expect(g[i]).toBeGreaterThan(g[i - 1]);
    // One decade per step: 10^(580/580); the repeated product drifts by rounding only.
    expect(g[290]).toBeCloseTo(1, 10);
    expect(logStep(1e-290, 1e290, 581)).toBeCloseTo(10, 12);
  });
});
