/**
 * What sampling costs a continuous design: the margins of the sampled loop
 * beside the continuous ones, and at the continuous crossover ωc the phase
 * the sampled loop has lost, ∠L(jωc) − ∠L(e^{jωcTs}), with the usual
 * estimate ωc·(Ts/2 + computation delay): the zero-order hold lags by
 * exactly ωTs/2 (its response is Ts·sinc(ωTs/2)·e^{−jωTs/2}; derivation), a
 * computation delay d by ωd, and the discretised controller adds its own
 * (small) phase error (Åström & Wittenmark, Computer-Controlled Systems,
 * 3rd ed., §8.2).
 */
import type { FrequencyModel } from '../../model/frequency-model.js';
import type { Margins } from '../margins.js';

export interface SamplingCost {
  continuousPhaseMarginDegrees: number | null;
  sampledPhaseMarginDegrees: number | null;
  /** Sampled minus continuous. */
  phaseMarginChangeDegrees: number | null;
  continuousGainMarginDb: number | null;
  sampledGainMarginDb: number | null;
  /** ωc of the continuous design (where its phase margin is taken). */
  crossoverFrequency: number | null;
  /** ∠L(jωc) − ∠L(e^{jωcTs}) in degrees, positive for a lag. */
  phaseLostAtCrossoverDegrees: number | null;
  /** 20·log10|L(e^{jωcTs})/L(jωc)|. */
  magnitudeChangeAtCrossoverDb: number | null;
  /** ωc·(Ts/2 + d) in degrees: hold and computation delay alone. */
  holdAndDelayEstimateDegrees: number | null;
}

const DEG = 180 / Math.PI;

export function samplingCost(
  continuousLoop: FrequencyModel,
  continuous: Margins,
  sampledLoop: FrequencyModel,
  sampled: Margins,
  samplePeriod: number,
  computationDelay: number,
): SamplingCost {
  const pmC = continuous.phase?.degrees ?? null;
  const pmS = sampled.phase?.degrees ?? null;
  const wc = continuous.phase?.frequency ?? null;
  let lost: number | null = null;
  let magnitude: number | null = null;
  let estimate: number | null = null;
  if (wc !== null && wc < Math.PI / samplePeriod) {
    const c = continuousLoop.evaluate(wc, { re: 0, im: 0 });
    const s = sampledLoop.evaluate(wc, { re: 0, im: 0 });
    // arg(Lc/Ls), principal value: the lag is well below 180° wherever ωc·Ts is sensible.
    lost = Math.atan2(c.im * s.re - c.re * s.im, c.re * s.re + c.im * s.im) * DEG;
    magnitude = 20 * Math.log10(Math.hypot(s.re, s.im) / Math.hypot(c.re, c.im));
    estimate = wc * (samplePeriod / 2 + computationDelay) * DEG;
  }
  return {
    continuousPhaseMarginDegrees: pmC,
    sampledPhaseMarginDegrees: pmS,
    phaseMarginChangeDegrees: pmC !== null && pmS !== null ? pmS - pmC : null,
    continuousGainMarginDb: continuous.gain?.db ?? null,
    sampledGainMarginDb: sampled.gain?.db ?? null,
    crossoverFrequency: wc,
    phaseLostAtCrossoverDegrees: lost,
    magnitudeChangeAtCrossoverDb: magnitude,
    holdAndDelayEstimateDegrees: estimate,
  };
}
