import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ERROR_CATALOGUE } from '../../src/contract/errors.js';
import { ESTIMATION_ERROR_CODES } from '../../src/estimation/index.js';

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? sources(p) : p.endsWith('.ts') ? [p] : [];
  });
}

describe('error catalogue', () => {
  it('lists every code the code base throws (ModelError, LoopgateError, estimation errors)', () => {
    const thrown = new Set<string>();
    for (const file of sources('src')) {
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/new (?:ModelError|LoopgateError)\(\s*'([a-z_]+)'/g)) thrown.add(m[1]);
      for (const m of text.matchAll(/fail\(\s*'([a-z_]+)'/g)) thrown.add(m[1]);
    }
    for (const code of Object.keys(ESTIMATION_ERROR_CODES)) thrown.add(code);
    expect(thrown.size).toBeGreaterThan(20);
    const missing = [...thrown].filter((c) => !Object.hasOwn(ERROR_CATALOGUE, c));
    expect(missing).toEqual([]);
  });

  it('gives 4xx for everything but the internal fault', () => {
    for (const [code, e] of Object.entries(ERROR_CATALOGUE)) {
      const status: number = e.statusCode;
      if (code === 'internal_error') expect(status).toBe(500);
      else expect((status >= 400 && status < 500) || status === 503).toBe(true);
    }
  });
});
