import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, requestHash } from '../../src/contract/request-hash.js';

/** The definition, written the plain way: the streamed version must give the same text. */
function plainCanonical(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(plainCanonical).join(',')}]`;
  const r = value as Record<string, unknown>;
  const keys = Object.keys(r).filter((k) => r[k] !== undefined).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${plainCanonical(r[k])}`).join(',')}}`;
}

describe('requestHash', () => {
  it('hashes the canonical text: sorted keys, no white space (digests computed with Python hashlib)', () => {
    const body = { b: [1, 2.5, { d: true, c: null }], a: 'x' };
    expect(canonicalJson(body)).toBe('{"a":"x","b":[1,2.5,{"c":null,"d":true}]}');
    expect(requestHash(body)).toBe('sha256:e0f686fa99b986db4dee57c944c64ae981c91ddff27ddbd407abaf7575b4c9f7');
    // UTF-8 of a non-ASCII character and an escaped quote.
    expect(requestHash({ k: 'é"q' })).toBe('sha256:eb6c97db60ea5dbbb9124cc62f9e16b62b6d3c21b9706a1be17e4fcf5b33abe7');
  });

  it('does not depend on key order or on undefined members', () => {
    expect(requestHash({ x: 1, y: { p: [3], q: 'r' } })).toBe(requestHash({ y: { q: 'r', p: [3], z: undefined }, x: 1 }));
  });

  it('escapes keys exactly as JSON.stringify does, plain or not', () => {
    const body = { 'a"b': 1, 'ü-key': 2, 'line\nbreak': 3, 'x.y-z_0': 4, '': 5, '\ud800': 6 };
    expect(canonicalJson(body)).toBe(plainCanonical(body));
  });

  it('streams long records in blocks with exactly the text of the plain definition', () => {
    const input = Array.from({ length: 50_000 }, (_, k) => Math.sin(0.37 * k) * 1e-3 * (k % 7) - (k % 5 === 0 ? 0 : 1e21 * (k % 3)));
    const body = { sampleRate: 2000, input, output: input.map((v) => -v), nested: [[1, [2, { a: [0.1, -0] }]], 'text', null, false] };
    const text = plainCanonical(body);
    expect(canonicalJson(body)).toBe(text);
    expect(requestHash(body)).toBe(`sha256:${createHash('sha256').update(text).digest('hex')}`);
  });
});
