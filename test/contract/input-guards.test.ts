/** The raw-body guards: each refusal names the field's path, however the body is nested. */
import { describe, expect, it } from 'vitest';
import { guardRawBody } from '../../src/contract/input-guards.js';

const refusal = (body: unknown) => {
  try {
    guardRawBody(body);
  } catch (e) {
    const err = e as { code: string; issues: { path: (string | number)[] }[]; message: string };
    return { code: err.code, path: err.issues[0].path, message: err.message };
  }
  return null;
};

describe('guardRawBody', () => {
  it('passes a body of finite numbers, strings and nulls', () => {
    expect(refusal({ plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 1] }, note: null })).toBeNull();
  });

  it('names the path of a non-finite number inside arrays and objects', () => {
    expect(refusal({ a: [1, 2, { b: [3, Infinity] }] })).toMatchObject({ code: 'non_finite_number', path: ['a', 2, 'b', 1], message: expect.stringContaining('a[2].b[1]') });
    expect(refusal({ plant: { numerator: [1, Number.NaN] } })).toMatchObject({ path: ['plant', 'numerator', 1] });
    expect(refusal(Number.NEGATIVE_INFINITY)).toMatchObject({ code: 'non_finite_number', path: [] });
  });

  it('refuses keys that could pollute prototypes, with their path', () => {
    expect(refusal(JSON.parse('{"x":[{"__proto__":{}}]}'))).toMatchObject({ code: 'forbidden_key', path: ['x', 0, '__proto__'] });
    expect(refusal({ constructor: 1 })).toMatchObject({ code: 'forbidden_key', path: ['constructor'] });
  });

  it('refuses nesting deeper than 64 levels without exhausting the stack', () => {
    const deep: unknown[] = [];
    let at = deep;
    for (let i = 0; i < 100_000; i++) {
      const next: unknown[] = [];
      at.push(next);
      at = next;
    }
    const r = refusal(deep);
    expect(r?.code).toBe('validation_failed');
    expect(r?.path).toHaveLength(65);
  });
});
