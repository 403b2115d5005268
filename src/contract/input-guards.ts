/**
 * Checks made on the raw body before the schema: numbers that are not
 * finite (JSON.parse turns 1e999 into Infinity) and keys that could pollute
 * prototypes. Iterative, so a deeply nested body cannot exhaust the stack.
 */
import { LoopgateError } from './errors.js';

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
const MAX_DEPTH = 64;

export function guardRawBody(body: unknown): void {
  const stack: { value: unknown; path: (string | number)[] }[] = [{ value: body, path: [] }];
  while (stack.length) {
    const { value, path } = stack.pop()!;
    if (typeof value === 'number') {
      if (!Number.isFinite(value)) {
        throw new LoopgateError('non_finite_number', `The number at ${formatPath(path)} is not finite (NaN, ±Infinity or too large for a double).`, [
          { path, message: 'must be a finite number' },
        ]);
      }
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (path.length > MAX_DEPTH) {
      throw new LoopgateError('validation_failed', `The body nests deeper than ${MAX_DEPTH} levels.`, [{ path, message: 'nested too deeply' }]);
    }
    if (Array.isArray(value)) {
      // Long records are arrays of numbers: check them in place, without a path per element.
      for (let i = 0; i < value.length; i++) {
        const v = value[i];
        if (typeof v === 'number') {
          if (!Number.isFinite(v)) stack.push({ value: v, path: [...path, i] });
        } else if (v !== null && typeof v === 'object') stack.push({ value: v, path: [...path, i] });
      }
      continue;
    }
    for (const key of Object.keys(value)) {
      if (FORBIDDEN_KEYS.has(key)) {
        throw new LoopgateError('forbidden_key', `The key "${key}" is not allowed (at ${formatPath([...path, key])}).`, [
          { path: [...path, key], message: 'forbidden key' },
        ]);
      }
      stack.push({ value: (value as Record<string, unknown>)[key], path: [...path, key] });
    }
  }
}

export const formatPath = (path: (string | number)[]): string =>
  path.length ? path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${p}`)).join('').replace(/^\./, '') : '(body)';
