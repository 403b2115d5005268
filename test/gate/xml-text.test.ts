import { describe, expect, it } from 'vitest';
import { xmlText } from '../../src/gate/xml-text.js';

describe('xmlText', () => {
  it('escapes the five markup characters', () => {
    expect(xmlText(`a<b>&"c'`)).toBe('a&lt;b&gt;&amp;&quot;c&apos;');
  });
  it('replaces characters XML 1.0 forbids and keeps tab, newline and surrogate pairs', () => {
    expect(xmlText('x\u0000y\u001Fz')).toBe('x\uFFFDy\uFFFDz');
    expect(xmlText('\t\n\r')).toBe('\t\n\r');
    expect(xmlText('\uD83D\uDE00')).toBe('\uD83D\uDE00');
    expect(xmlText('a\uD800b\uDC00')).toBe('a\uFFFDb\uFFFD');
  });
});
