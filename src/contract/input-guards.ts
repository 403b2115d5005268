/**
 * Checks made on the raw body before the schema: numbers that are not
 * finite (JSON.parse turns 1e999 into Infinity) and keys that could pollute
 * prototypes. Iterative, so a deeply nested body cannot exhaust the stack.
 */
import { LoopgateError } from './errors.js';

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
const MAX_DEPTH = 64;

/**
 * The walk keeps, for each object or array it has yet to visit, only where it hangs (its parent's
 * entry and its key); a path is spelt out only for the error. A request's body has tens of such
 * nodes, and a path array per node was about 5 KB of garbage per analysis.
 */
export function guardRawBody(body: unknown): void {
  // Entry k: a node to visit, its parent's entry (−1 for the body) and its key there; depth by entry.
  const values: unknown[] = [body];
  const parents: number[] = [-1];
  const keys: (string | number)[] = [''];
  const depths: number[] = [0];
  const pathOf = (entry: number, last?: string | number): (string | number)[] => {
    const path: (string | number)[] = last === undefined ? [] : [last];
    for (let e = entry; e > 0; e = parents[e]) path.push(keys[e]);
    return path.reverse();
  };
  const nonFinite = (entry: number, last?: string | number) => {
    const path = pathOf(entry, last);
    return new LoopgateError('non_finite_number', `The number at ${formatPath(path)} is not finite (NaN, ±Infinity or too large for a double).`, [
      { path, message: 'must be a finite number' },
    ]);
  };
  if (typeof body === 'number' && !Number.isFinite(body)) throw nonFinite(0);
  // Entries are visited in order of creation: every parent entry stays where it is.
  for (let entry = 0; entry < values.length; entry++) {
    const value = values[entry];
    if (value === null || typeof value !== 'object') continue;
    const depth = depths[entry];
    if (depth > MAX_DEPTH) {
      const path = pathOf(entry);
      throw new LoopgateError('validation_failed', `The body nests deeper than ${MAX_DEPTH} levels.`, [{ path, message: 'nested too deeply' }]);
    }
    const visit = (child: unknown, key: string | number) => {
      if (typeof child === 'number') {
        if (!Number.isFinite(child)) throw nonFinite(entry, key);
      } else if (child !== null && typeof child === 'object') {
        values.push(child);
        parents.push(entry);
        keys.push(key);
        depths.push(depth + 1);
      }
    };
    if (Array.isArray(value)) {
      // Long records are arrays of numbers: checked in place.
      for (let i = 0; i < value.length; i++) visit(value[i], i);
      continue;
    }
    for (const key of Object.keys(value)) {
      if (FORBIDDEN_KEYS.has(key)) {
        const path = pathOf(entry, key);
        throw new LoopgateError('forbidden_key', `The key "${key}" is not allowed (at ${formatPath(path)}).`, [{ path, message: 'forbidden key' }]);
      }
      visit((value as Record<string, unknown>)[key], key);
    }
  }
}

export const formatPath = (path: (string | number)[]): string =>
  path.length ? path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${p}`)).join('').replace(/^\./, '') : '(body)';
