/**
 * The command line must not load the HTTP framework (it checks in-process,
 * or uses the global fetch with --server). Walks the import graph of the
 * BUILT entry point, as node would load it.
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ENTRY = fileURLToPath(new URL('../../dist/cli/main.js', import.meta.url));
const SPECIFIER = /(?:^|\s|;)(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|^import\s*['"]([^'"]+)['"]/gm;

function packagesReached(entry: string): Set<string> {
  const seen = new Set<string>();
  const packages = new Set<string>();
  const stack = [entry];
  while (stack.length) {
    const file = stack.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    for (const m of readFileSync(file, 'utf8').matchAll(SPECIFIER)) {
      const spec = m[1] ?? m[2] ?? m[3];
      if (spec.startsWith('.')) stack.push(resolve(dirname(file), spec));
      else packages.add(spec);
    }
  }
  return packages;
}

describe('the command line', () => {
  it('never imports fastify', () => {
    const reached = packagesReached(ENTRY);
    expect(reached.has('zod')).toBe(true); // the walk does reach the contract
    expect([...reached].filter((p) => /fastify/.test(p))).toEqual([]);
  });
});
