/** Short human-readable forms of a loop's figures and findings, shared by the text and JUnit reports. */
import type { Finding, LoopSummary } from '../contract/schemas/checks.js';

/** Margins that do not exist because nothing crosses are unbounded (∞); a delay margin missing while |L| crosses 1 is "none". */
export function figureCells(s: LoopSummary): { gm: string; pm: string; dm: string; ms: string; mt: string } {
  const { gain, phase, delay } = s.margins;
  return {
    gm: gain ? Math.abs(gain.db).toFixed(2) : '∞',
    pm: phase ? phase.degrees.toFixed(1) : '∞',
    dm: delay ? delay.seconds.toPrecision(3) : phase ? 'none' : '∞',
    ms: s.peaks.sensitivity.value.toFixed(3),
    mt: s.peaks.complementarySensitivity.value.toFixed(3),
  };
}

export function formatFigures(s: LoopSummary): string {
  const c = figureCells(s);
  const dm = c.dm === 'none' ? 'none' : `${c.dm} s`;
  return `closed loop ${s.closedLoopStable ? 'stable' : 'UNSTABLE'}; GM ${c.gm} dB, PM ${c.pm}°, DM ${dm}, Ms ${c.ms}, Mt ${c.mt}`;
}

export function formatFinding(f: Finding): string {
  const numbers = f.value !== null || f.limit !== null ? ` (value ${f.value === null ? 'none' : round(f.value)}, limit ${f.limit === null ? '–' : round(f.limit)})` : '';
  return `[${f.severity}] ${f.code}: ${f.message}${numbers} — source: ${f.source}`;
}

const round = (x: number) => (Number.isInteger(x) ? String(x) : x.toPrecision(4));
