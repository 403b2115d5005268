import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { requestHash } from '../../src/contract/request-hash.js';

/**
 * Digests computed by an independent implementation of the canonical request
 * encoding in Python (json, struct, hashlib):
 * scripts/fixtures/make_request_hash_reference.py.
 */
interface Case {
  name: string;
  json?: string;
  ramp?: number;
  hash: string;
}
const reference = JSON.parse(readFileSync(new URL('../../fixtures/reference/request-hash.json', import.meta.url), 'utf8')) as { cases: Case[] };

/** The fixture's recipe for long records: (3k − 1000)/7 is one correctly rounded division in both languages. */
function rampBody(n: number) {
  const input = Array.from({ length: n }, (_, k) => (3 * k - 1000) / 7);
  return { sampleRate: 1000, input, output: input.map((x) => -x), note: 'x'.repeat(40000) };
}

describe('requestHash', () => {
  it.each(reference.cases.map((c) => [c.name, c] as const))('matches the Python reference: %s', (_, c) => {
    const body: unknown = c.json !== undefined ? JSON.parse(c.json) : rampBody(c.ramp!);
    expect(requestHash(body)).toBe(c.hash);
  });

  it('ignores key order, number spelling and the sign of zero, and sees every other difference', () => {
    const byName = new Map(reference.cases.map((c) => [c.name, c.hash]));
    expect(byName.get('small mixed body')).toBe(byName.get('same body, other key order and spelling'));
    expect(requestHash({ x: 1, y: { p: [3], q: 'r' } })).toBe(requestHash({ y: { q: 'r', p: [3], z: undefined }, x: 1 }));
    expect(requestHash({ g: -0 })).toBe(requestHash({ g: 0 }));
    const base = { plant: { numerator: [1.8], denominator: [2090, 117, 1] }, name: 'ab' };
    const variants = [
      { plant: { numerator: [1.8000000000000003], denominator: [2090, 117, 1] }, name: 'ab' },
      { plant: { numerator: [1.8], denominator: [2090, 117, 1, 0] }, name: 'ab' },
      { plant: { numerator: [1.8], denominator: [2090, 117, 1] }, name: 'a' },
      { plant: { numerator: ['1.8'], denominator: [2090, 117, 1] }, name: 'ab' },
      { plant: { numerator: [[1.8]], denominator: [2090, 117, 1] }, name: 'ab' },
      { plant: { numerator: [1.8], denominator: [2090, 117, 1] }, name: 'ab', extra: null },
    ];
    const hashes = new Set([base, ...variants].map(requestHash));
    expect(hashes.size).toBe(variants.length + 1);
  });
});
