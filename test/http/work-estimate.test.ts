import { describe, expect, it } from 'vitest';
import { ANALYSIS_GRID_ALLOWANCE, estimateWork, plantOrder } from '../../src/http/work-estimate.js';

describe('estimateWork', () => {
  it('reads the model order of each plant kind', () => {
    expect(plantOrder({ kind: 'transfer-function', numerator: [1], denominator: [1, 3, 3, 1] })).toBe(3);
    expect(plantOrder({ kind: 'zeros-poles', zeros: [-1], poles: [-2, -3], gain: 1 })).toBe(2);
    expect(plantOrder({ kind: 'state-space', a: [[-1, 0], [0, -2]], b: [[1], [1]], c: [[1, 1]] })).toBe(2);
    expect(plantOrder({ kind: 'expression', expression: '1/(s+1)' })).toBe(7);
    expect(plantOrder({ kind: 'measured', frequency: [1, 2, 3, 4, 5] })).toBe(5);
  });

  it('charges points × order for every loop, wherever it sits in the body', () => {
    const loop = (n: number, points?: number) => ({
      plant: { kind: 'transfer-function', numerator: [1], denominator: new Array(n + 1).fill(1) },
      ...(points ? { frequency: { min: 0.01, max: 100, points } } : {}),
    });
    const single = estimateWork(loop(3, 1000));
    expect(single.loops).toEqual([{ kind: 'transfer-function', order: 3, requestedPoints: 1000, points: 1000 + ANALYSIS_GRID_ALLOWANCE }]);
    expect(single.work).toBe(3 * (1000 + ANALYSIS_GRID_ALLOWANCE));
    const batch = estimateWork({ loops: [loop(2), loop(4)], compare: { baseline: loop(1), candidate: loop(1) } });
    expect(batch.loops).toHaveLength(4);
    expect(batch.work).toBe((2 + 4 + 1 + 1) * ANALYSIS_GRID_ALLOWANCE);
  });

  it('reports the longest array of numbers', () => {
    expect(estimateWork({ input: new Array(5000).fill(0), output: [1, 2] }).longestRecord).toBe(5000);
  });

  it('survives hostile shapes: deep nesting, huge counts, odd types', () => {
    let deep: unknown = { plant: { kind: 'expression', expression: 's' } };
    for (let i = 0; i < 10_000; i++) deep = { x: deep };
    expect(estimateWork(deep).loops).toHaveLength(0); // beyond the walk depth: left to the schema's guard
    expect(estimateWork({ plant: { kind: 7 }, frequency: { points: 'many' } }).loops[0]).toMatchObject({ kind: 'unknown', requestedPoints: 0 });
    expect(estimateWork({ plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 1] }, frequency: { points: 1e300 } }).work).toBe(1e9 + ANALYSIS_GRID_ALLOWANCE);
    expect(estimateWork('text').work).toBe(0);
  });
});
