import { describe, expect, it } from 'vitest';
import { LoopgateError } from '../../src/contract/errors.js';
import { checksOrThrow, runLoopTask } from '../../src/gate/loop-outcome.js';
import { loopTasks, parseCheckRequest } from '../../src/gate/run-checks.js';
import { thirdOrderLag } from './support/closed-form-loops.js';

const tasks = loopTasks(
  parseCheckRequest({
    loops: [
      { name: 'a', plant: thirdOrderLag(1) },
      { name: 'b', plant: { kind: 'transfer-function', numerator: [1], denominator: [0] } },
      { name: 'c', plant: { kind: 'transfer-function', numerator: [1, 2], denominator: [1, 3] }, controller: { kind: 'pid', form: 'parallel', kp: 1, kd: 1 } },
    ],
  }),
);

describe('loop outcomes', () => {
  it('a loop is checked, or refused with its code and path under loops[i]', () => {
    expect(runLoopTask(tasks[0])).toMatchObject({ index: 0, kind: 'checked', check: { name: 'a' } });
    expect(runLoopTask(tasks[1])).toMatchObject({ index: 1, kind: 'refused', code: 'zero_denominator', issues: [{ path: ['loops', 1, 'plant', 'denominator'] }] });
    expect(runLoopTask(tasks[2])).toMatchObject({ index: 2, kind: 'refused', code: 'improper_loop' });
  });

  it('checksOrThrow orders by index and throws the refusal of the lowest index', () => {
    const outcomes = [runLoopTask(tasks[2]), runLoopTask(tasks[0]), runLoopTask(tasks[1])];
    expect(() => checksOrThrow(outcomes)).toThrow(LoopgateError);
    try {
      checksOrThrow(outcomes);
    } catch (err) {
      expect((err as LoopgateError).code).toBe('zero_denominator');
      expect((err as LoopgateError).message).toMatch(/^loops\[1\]: /);
    }
    expect(checksOrThrow([runLoopTask(tasks[0])]).map((c) => c.name)).toEqual(['a']);
  });

  it('a fault of ours becomes 500 internal_error naming the loop, never a pass', () => {
    try {
      checksOrThrow([{ index: 4, kind: 'fault', message: 'boom' }]);
      expect.unreachable();
    } catch (err) {
      expect((err as LoopgateError).statusCode).toBe(500);
      expect((err as LoopgateError).message).toContain('loops[4]');
    }
  });
});
