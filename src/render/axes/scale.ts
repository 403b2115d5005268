/**
 * Scales: maps from data values to screen coordinates. A linear scale maps
 * [d0, d1] onto [r0, r1]; a log scale does the same in log10 of the value.
 * Screen y grows downward, so callers pass r0 > r1 for vertical axes.
 */
export interface Scale {
  (value: number): number;
  domain: readonly [number, number];
  range: readonly [number, number];
  invert(screen: number): number;
  kind: 'linear' | 'log';
}

export function linearScale(domain: readonly [number, number], range: readonly [number, number]): Scale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const k = (r1 - r0) / (d1 - d0 || 1);
  const f = ((v: number) => r0 + (v - d0) * k) as Scale;
  f.domain = domain;
  f.range = range;
  f.invert = (s) => d0 + (s - r0) / k;
  f.kind = 'linear';
  return f;
}

export function logScale(domain: readonly [number, number], range: readonly [number, number]): Scale {
  const inner = linearScale([Math.log10(domain[0]), Math.log10(domain[1])], range);
  const f = ((v: number) => (v > 0 ? inner(Math.log10(v)) : NaN)) as Scale;
  f.domain = domain;
  f.range = range;
  f.invert = (s) => Math.pow(10, inner.invert(s));
  f.kind = 'log';
  return f;
}
