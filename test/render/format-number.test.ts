import { describe, expect, it } from 'vitest';
import { formatFixed, formatNumber, parseFormattedNumber } from '../../src/render/format-number.js';

describe('formatNumber', () => {
  it('gives three significant digits without trailing zeros, with a true minus sign', () => {
    expect(formatNumber(7.732110496441246)).toBe('7.73');
    expect(formatNumber(-0.1732)).toBe('\u22120.173');
    expect(formatNumber(2)).toBe('2');
    expect(formatNumber(0.5)).toBe('0.5');
    expect(formatNumber(1970.77)).toBe('1970');
    expect(formatNumber(0)).toBe('0');
  });

  it('writes powers of ten outside 1e−3 … 1e5', () => {
    expect(formatNumber(1e-4)).toBe('10⁻⁴');
    expect(formatNumber(2.5e6)).toBe('2.5×10⁶');
    expect(formatNumber(Infinity)).toBe('∞');
  });

  it('round-trips through parseFormattedNumber to the shown precision', () => {
    for (const v of [7.7321, -0.17321, 1e-4, 2.5e6, -3.2e-7, 123.456]) {
      const back = parseFormattedNumber(formatNumber(v));
      expect(Math.abs(back - v) / Math.abs(v)).toBeLessThan(5e-3);
    }
  });

  it('formatFixed keeps the decimals and never prints −0', () => {
    expect(formatFixed(51.3337, 1)).toBe('51.3');
    expect(formatFixed(-0.01, 1)).toBe('0.0');
    expect(formatFixed(-8.25, 2)).toBe('\u22128.25');
  });
});
