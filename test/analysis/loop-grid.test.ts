/**
 * The analysis grid's reused column buffer (withLoopGrid): a grid built in the
 * buffer a previous grid used must hold exactly what a grid in a buffer of its
 * own holds, and a grid built while the buffer is lent must not touch it.
 */
import { describe, expect, it } from 'vitest';
import { buildLoopGrid, withLoopGrid, type LoopGrid } from '../../src/analysis/loop-grid.js';
import { analyze } from '../../src/index.js';
import { buildLoop } from '../../src/contract/build-loop.js';

/** 4/(s(s² + 4)): poles at 0 and ±2j, so intervals around ω = 2 straddle a pole. */
const onAxis = buildLoop({ plant: { kind: 'transfer-function', numerator: [4], denominator: [1, 0, 4, 0] } }).loop;
/** 2/((s + 1)(0.1 s + 1)): no pole on the imaginary axis. */
const plain = buildLoop({ plant: { kind: 'transfer-function', numerator: [2], denominator: [0.1, 1.1, 1] } }).loop;

const columns = (g: LoopGrid) => ({
  omega: Array.from(g.omega),
  re: Array.from(g.re),
  im: Array.from(g.im),
  magnitude: Array.from(g.magnitude),
  phaseDeg: Array.from(g.phaseDeg),
  returnArg: Array.from(g.returnArg),
  returnMagnitude: Array.from(g.returnMagnitude),
  straddlesPole: Array.from(g.straddlesPole),
  truncated: g.truncated,
});

describe('withLoopGrid', () => {
  it('a grid in the reused buffer equals one in its own buffer, pole flags of the grid before included', () => {
    const flagged = withLoopGrid(onAxis, 0.01, 100, (g) => g.straddlesPole.reduce((n, f) => n + f, 0));
    // Precondition: the first grid did set flags, so the second has something to clear.
    expect(flagged).toBeGreaterThan(0);
    const reused = withLoopGrid(plain, 0.01, 100, columns);
    expect(reused).toEqual(columns(buildLoopGrid(plain, 0.01, 100)));
    expect(reused.straddlesPole.every((f) => f === 0)).toBe(true);
  });

  it('a grid built while the buffer is lent gets a buffer of its own', () => {
    const fresh = columns(buildLoopGrid(onAxis, 0.01, 100));
    withLoopGrid(onAxis, 0.01, 100, (outer) => {
      const innerBuffer = withLoopGrid(plain, 0.001, 1000, (inner) => inner.omega.buffer);
      expect(innerBuffer).not.toBe(outer.omega.buffer);
      expect(columns(outer)).toEqual(fresh);
    });
  });

  it('gives the buffer back when the callback throws', () => {
    let lent: ArrayBufferLike | null = null;
    expect(() =>
      withLoopGrid(plain, 0.01, 100, (g) => {
        lent = g.omega.buffer;
        throw new Error('inside');
      }),
    ).toThrow('inside');
    expect(withLoopGrid(plain, 0.01, 100, (g) => g.omega.buffer)).toBe(lent);
  });

  it('analyses in turn do not leak into each other', () => {
    const a = { plant: { kind: 'transfer-function', numerator: [4], denominator: [1, 0, 4, 0] }, controller: { kind: 'pid', form: 'parallel', kp: 0.5, ki: 0.05 } };
    const b = { plant: { kind: 'transfer-function', numerator: [2], denominator: [0.1, 1.1, 1], delay: 0.05 } };
    const first = analyze(a);
    analyze(b);
    expect(analyze(a)).toEqual(first);
  });
});
