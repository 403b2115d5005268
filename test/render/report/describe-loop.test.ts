import { describe, expect, it } from 'vitest';
import { describeController, describePlant, polynomialText } from '../../../src/render/report/describe-loop.js';

describe('describe-loop', () => {
  it('writes polynomials in descending powers of s', () => {
    expect(polynomialText([0.028, 0.43, 1])).toBe('0.028 s² + 0.43 s + 1');
    expect(polynomialText([1, 0, -4])).toBe('s² − 4');
    expect(polynomialText([-2, 0])).toBe('−2 s');
    expect(polynomialText([0])).toBe('0');
  });

  it('describes each plant kind', () => {
    expect(describePlant({ kind: 'transfer-function', numerator: [0.92], denominator: [0.028, 0.43, 1], delay: 0.02 })).toBe(
      'P(s) = (0.92) / (0.028 s² + 0.43 s + 1) · e^(−0.02 s)',
    );
    expect(describePlant({ kind: 'zeros-poles', zeros: [], poles: [-1, { re: -1, im: 2 }, { re: -1, im: -2 }], gain: 3 })).toBe(
      'P(s) = 3 · zeros [] / poles [−1, −1 + 2j, −1 − 2j]',
    );
    expect(describePlant({ kind: 'state-space', a: [[-1, 0], [0, -2]], b: [[1], [1]], c: [[1, 1]] })).toBe('State-space model with 2 state(s)');
    expect(describePlant({ kind: 'expression', expression: 'exp(-s)/(s+1)' })).toBe('P(s) = exp(-s)/(s+1)');
  });

  it('names the controller form and its parameters', () => {
    expect(describeController({ kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 })).toBe('PI, standard form: K = 3.5, Ti = 0.39 s');
    expect(describeController({ kind: 'pid', form: 'series', gain: 1.9, integralTime: 95, derivativeTime: 22, derivativeFilter: { n: 10 } })).toBe(
      'PID, series form: K = 1.9, Ti = 95 s, Td = 22 s, derivative filter N = 10',
    );
    expect(describeController({ kind: 'pid', form: 'parallel', kp: 2, ki: 1 })).toBe('PID, parallel form: kp = 2, ki = 1 1/s, kd = 0 s');
    expect(describeController(undefined)).toMatch(/^None/);
  });
});
