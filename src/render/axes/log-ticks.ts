/**
 * Ticks for a log10 axis: labelled majors at every decade (every second or
 * third decade when there are many), unlabelled minors at 2…9 × 10ⁿ, and —
 * when the axis spans less than about two decades — labelled 2 and 5 ×
 * 10ⁿ as well, so a short axis still has readable numbers.
 */
export interface LogTicks {
  /** Axis limits widened outward to whole decades. */
  lo: number;
  hi: number;
  major: number[];
  minor: number[];
}

export function logTicks(lo: number, hi: number, maxLabels = 9): LogTicks {
  if (!(lo > 0) || !(hi > lo)) throw new RangeError(`log axis needs 0 < lo < hi, got ${lo}, ${hi}`);
  const e0 = Math.floor(Math.log10(lo) + 1e-9);
  const e1 = Math.ceil(Math.log10(hi) - 1e-9);
  const decades = Math.max(1, e1 - e0);
  const every = Math.max(1, Math.ceil((decades + 1) / maxLabels));
  const major: number[] = [];
  const minor: number[] = [];
  for (let e = e0; e <= e1; e++) {
    const base = decimalPower(e);
    if ((e - e0) % every === 0) major.push(base);
    else minor.push(base);
    if (e === e1) break;
    for (let m = 2; m <= 9; m++) {
      const v = Number((m * base).toPrecision(12));
      if (decades <= 2 && (m === 2 || m === 5)) major.push(v);
      else minor.push(v);
    }
  }
  major.sort((a, b) => a - b);
  return { lo: decimalPower(e0), hi: decimalPower(e1 === e0 ? e0 + 1 : e1), major, minor };
}

/** 10^e written exactly (1e-3 rather than 0.0010000000000000002). */
function decimalPower(e: number): number {
  return Number(`1e${e}`);
}
