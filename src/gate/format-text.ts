/**
 * A check's answer as a table a person reads at a glance: one row per loop
 * with its verdict and figures, then the findings of every loop that does
 * not simply pass, then a one-line tally.
 */
import type { CheckResponse } from '../contract/schemas/checks.js';
import { figureCells, formatFinding } from './format-figures.js';

const MAX_NAME = 40;

function clip(name: string): string {
  return name.length > MAX_NAME ? `${name.slice(0, MAX_NAME - 1)}…` : name;
}

function table(rows: string[][]): string[] {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  // Names left-aligned, figures right-aligned.
  return rows.map((r) => r.map((cell, c) => (c < 2 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ').trimEnd());
}

export function formatText(result: CheckResponse): string {
  const header = ['LOOP', 'VERDICT', 'STABLE', 'GM dB', 'PM °', 'DM s', 'Ms', 'Mt'];
  const rows = result.loops.map((l) => {
    const c = figureCells(l.summary);
    return [clip(l.name), l.verdict.toUpperCase(), l.summary.closedLoopStable ? 'yes' : 'NO', c.gm, c.pm, c.dm, c.ms, c.mt];
  });
  const lines = table([header, ...rows]);
  const flagged = result.loops.filter((l) => l.findings.length);
  if (flagged.length) {
    lines.push('');
    for (const l of flagged) {
      lines.push(`${l.name} — ${l.verdict}`);
      for (const f of l.findings) lines.push(`  ${formatFinding(f)}`);
    }
  }
  const { pass, warn, fail } = result.counts;
  lines.push('', `${result.verdict.toUpperCase()}: ${result.loops.length} loop(s) — ${pass} pass, ${warn} warn, ${fail} fail (profile ${result.profile}; ${result.requestHash.slice(0, 19)}…)`);
  return lines.join('\n') + '\n';
}
