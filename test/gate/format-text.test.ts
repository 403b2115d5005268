import { describe, expect, it } from 'vitest';
import { formatText } from '../../src/gate/format-text.js';
import { runChecks } from '../../src/gate/run-checks.js';
import { thirdOrderGainFor, thirdOrderLag } from './support/closed-form-loops.js';

describe('formatText', () => {
  it('prints one aligned row per loop, the findings of loops that do not pass, and the tally', async () => {
    const result = await runChecks({
      loops: [
        { name: 'filler-pump speed', plant: thirdOrderLag(0.5) },
        { name: 'pasteuriser temperature', plant: thirdOrderLag(thirdOrderGainFor(5)) },
      ],
    });
    const text = formatText(result);
    const lines = text.split('\n');
    expect(lines[0]).toMatch(/^LOOP\s+VERDICT\s+STABLE\s+GM dB\s+PM °\s+DM s\s+Ms\s+Mt$/);
    expect(lines[1]).toMatch(/^filler-pump speed\s+PASS\s+yes\s+21\.58\s/); // GM = 6/0.5 = 12 → 21.58 dB
    expect(lines[2]).toMatch(/^pasteuriser temperature\s+FAIL\s+yes\s+5\.00\s/);
    // Columns line up: each row as long as the header's columns allow.
    expect(lines[1].indexOf('PASS')).toBe(lines[0].indexOf('VERDICT'));
    expect(text).toContain('pasteuriser temperature — fail');
    expect(text).toContain('[fail] gain_margin_low');
    expect(text).not.toContain('filler-pump speed — ');
    expect(lines.at(-2)).toMatch(/^FAIL: 2 loop\(s\) — 1 pass, 0 warn, 1 fail \(profile baseline; sha256:/);
  });

  it('shows unbounded margins as ∞ and an unstable loop as NO', async () => {
    const result = await runChecks({
      loops: [
        { name: 'integrator', plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 0] } },
        { name: 'unstable', plant: thirdOrderLag(7) },
      ],
    });
    const [, integrator, unstable] = formatText(result).split('\n');
    expect(integrator).toMatch(/integrator\s+PASS\s+yes\s+∞\s+90\.0\s+1\.57/);
    expect(unstable).toMatch(/unstable\s+FAIL\s+NO\s/);
  });
});
