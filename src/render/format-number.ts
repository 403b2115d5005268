/**
 * Numbers as people read them on a figure: a few significant digits, no
 * trailing zeros, a true minus sign (U+2212), and powers of ten in
 * scientific form outside 1e−3 … 1e5.
 */
const MINUS = '\u2212';
const SUPERSCRIPT: Record<string, string> = { '-': '\u207b', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

export function formatNumber(value: number, significantDigits = 3): string {
  if (Number.isNaN(value)) return 'n/a';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : `${MINUS}∞`;
  if (value === 0) return '0';
  const abs = Math.abs(value);
  let text: string;
  if (abs >= 1e5 || abs < 1e-3) {
    const [mantissa, exponent] = abs.toExponential(significantDigits - 1).split('e');
    const m = stripZeros(mantissa);
    text = `${m === '1' ? '' : `${m}×`}10${superscript(String(Number(exponent)))}`;
  } else {
    text = stripZeros(abs.toPrecision(significantDigits));
    if (text.includes('e')) text = stripZeros(String(Number(text)));
  }
  return value < 0 ? `${MINUS}${text}` : text;
}

/** Fixed decimals (for figures with units such as dB or degrees), with the true minus sign. */
export function formatFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return formatNumber(value);
  const text = Math.abs(value).toFixed(decimals);
  return value < 0 && Number(text) !== 0 ? `${MINUS}${text}` : text;
}

/** Undoes the typography (minus sign, ×10ⁿ) so tests and the page can compare with the API's numbers. */
export function parseFormattedNumber(text: string): number {
  const t = text.trim().replace(/\u2212/g, '-');
  const sci = /^(-?)(?:([\d.]+)×)?10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/.exec(t);
  if (sci) {
    const exponent = Number([...sci[3]].map((c) => Object.keys(SUPERSCRIPT).find((k) => SUPERSCRIPT[k] === c)).join(''));
    return (sci[1] ? -1 : 1) * Number(sci[2] ?? '1') * Math.pow(10, exponent);
  }
  if (t === '∞') return Infinity;
  if (t === '-∞') return -Infinity;
  return Number(t);
}

function stripZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

function superscript(s: string): string {
  return [...s].map((c) => SUPERSCRIPT[c] ?? c).join('');
}
