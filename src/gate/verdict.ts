/** Verdicts: fail beats warn beats pass. */
import type { Finding, Verdict } from '../contract/schemas/checks.js';

const RANK: Record<Verdict, number> = { pass: 0, warn: 1, fail: 2 };

export function worstVerdict(verdicts: Iterable<Verdict>): Verdict {
  let worst: Verdict = 'pass';
  for (const v of verdicts) if (RANK[v] > RANK[worst]) worst = v;
  return worst;
}

export const verdictOf = (findings: readonly Finding[]): Verdict => worstVerdict(findings.map((f) => f.severity));
