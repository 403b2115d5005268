/**
 * Gain, phase and delay margins from the crossings (definitions as in
 * Skogestad & Postlethwaite, Multivariable Feedback Control, 2nd ed., §2.4.3;
 * delay margin PM/ωc as in Åström & Murray, Feedback Systems, §10.3).
 *
 * - Every phase crossover gives a gain margin 1/|L|; the one nearest to
 *   instability (smallest |dB|) is `gain`. For an open-loop unstable plant it
 *   may be a ratio below 1: a limit on gain *reduction*.
 * - Every gain crossover gives a phase margin 180° + ∠L, wrapped to
 *   (−180°, 180°]; the smallest is `phase`.
 * - Each crossover with a positive phase margin tolerates an extra delay of
 *   PM/ωc; the smallest is `delay`.
 */
import { wrapDegrees } from '../numeric/unwrap.js';
import type { Crossing } from './crossings.js';

export interface GainCrossover {
  frequency: number;
  phaseMarginDegrees: number;
  delayMarginSeconds: number | null;
}

export interface PhaseCrossover {
  frequency: number;
  ratio: number;
  db: number;
}

export interface Margins {
  gain: { ratio: number; db: number; frequency: number } | null;
  phase: { degrees: number; frequency: number } | null;
  delay: { seconds: number; frequency: number } | null;
  gainCrossovers: GainCrossover[];
  phaseCrossovers: PhaseCrossover[];
}

export function computeMargins(gainCrossings: Crossing[], phaseCrossings: Crossing[]): Margins {
  const gainCrossovers = gainCrossings.map((c): GainCrossover => {
    const pm = wrapDegrees(180 + (Math.atan2(c.im, c.re) * 180) / Math.PI);
    return {
      frequency: c.frequency,
      phaseMarginDegrees: pm,
      delayMarginSeconds: pm > 0 ? (pm * Math.PI) / 180 / c.frequency : null,
    };
  });
  const phaseCrossovers = phaseCrossings
    .map((c): PhaseCrossover => {
      const m = Math.hypot(c.re, c.im);
      return { frequency: c.frequency, ratio: 1 / m, db: -20 * Math.log10(m) };
    })
    .sort((a, b) => Math.abs(a.db) - Math.abs(b.db) || a.frequency - b.frequency);
  let phase: Margins['phase'] = null;
  let delay: Margins['delay'] = null;
  for (const g of gainCrossovers) {
    if (!phase || g.phaseMarginDegrees < phase.degrees) phase = { degrees: g.phaseMarginDegrees, frequency: g.frequency };
    if (g.delayMarginSeconds !== null && (!delay || g.delayMarginSeconds < delay.seconds)) {
      delay = { seconds: g.delayMarginSeconds, frequency: g.frequency };
    }
  }
  const first = phaseCrossovers[0];
  return {
    gain: first ? { ratio: first.ratio, db: first.db, frequency: first.frequency } : null,
    phase,
    delay,
    gainCrossovers,
    phaseCrossovers,
  };
}
