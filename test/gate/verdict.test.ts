import { describe, expect, it } from 'vitest';
import { verdictOf, worstVerdict } from '../../src/gate/verdict.js';

const finding = (severity: 'fail' | 'warn') => ({ code: 'x', message: 'm', value: null, limit: null, source: 's', severity, criterion: null });

describe('verdicts', () => {
  it('fail beats warn beats pass; nothing is a pass', () => {
    expect(worstVerdict([])).toBe('pass');
    expect(worstVerdict(['pass', 'warn', 'pass'])).toBe('warn');
    expect(worstVerdict(['warn', 'fail', 'pass'])).toBe('fail');
    expect(verdictOf([])).toBe('pass');
    expect(verdictOf([finding('warn')])).toBe('warn');
    expect(verdictOf([finding('warn'), finding('fail')])).toBe('fail');
  });
});
