/**
 * Loops whose review figures are known in closed form, for tests on both
 * sides of each threshold. Each says where its formula comes from.
 */

/** K/(s(s+1)(s+2)): phase crossover √2 rad/s, GM = 6/K (Ogata, Modern Control Engineering, 5th ed.). */
export const thirdOrderLag = (k: number) => ({ kind: 'transfer-function' as const, numerator: [k], denominator: [1, 3, 2, 0] });
export const thirdOrderGainMarginDb = (k: number) => 20 * Math.log10(6 / k);
/** The K that gives a gain margin of `db` dB. */
export const thirdOrderGainFor = (db: number) => 6 / Math.pow(10, db / 20);

/**
 * k·e^{−sT}/s (derivation, REFERENCES.md "classic closed forms"): crossover k,
 * PM = π/2 − kT, GM = π/(2kT), delay margin π/(2k) − T.
 */
export const delayedIntegrator = (k: number, delay: number) => ({ kind: 'transfer-function' as const, numerator: [k], denominator: [1, 0], delay });
export const delayedIntegratorPhaseMarginDeg = (k: number, delay: number) => ((Math.PI / 2 - k * delay) * 180) / Math.PI;
export const delayedIntegratorDelayMargin = (k: number, delay: number) => Math.PI / (2 * k) - delay;
/** The delay that gives a phase margin of `deg` degrees at gain k. */
export const delayForPhaseMargin = (k: number, deg: number) => (Math.PI / 2 - (deg * Math.PI) / 180) / k;

/** ωn²/(s(s + 2ζωn)) with ωn = 1: closed loop 1/(s² + 2ζs + 1). */
export const secondOrderLoop = (zeta: number) => ({ kind: 'transfer-function' as const, numerator: [1], denominator: [1, 2 * zeta, 0] });
/** Mt = 1/(2ζ√(1−ζ²)) for ζ < 1/√2 (Ogata, Modern Control Engineering, 5th ed.: resonant peak). */
export const secondOrderMt = (zeta: number) => 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta));
/**
 * Ms of the same loop (derivation): |S|² = x(x + 4ζ²)/((1 − x)² + 4ζ²x) with
 * x = ω²; setting its derivative to zero leaves x² − x − 2ζ² = 0, so the peak
 * is at x = (1 + √(1 + 8ζ²))/2.
 */
export function secondOrderMs(zeta: number): number {
  const a = 4 * zeta * zeta;
  const x = (1 + Math.sqrt(1 + 2 * a)) / 2;
  return Math.sqrt((x * (x + a)) / ((1 - x) * (1 - x) + a * x));
}
/** PM = atan(2ζ/√(√(1+4ζ⁴) − 2ζ²)) (Ogata; REFERENCES.md). */
export const secondOrderPhaseMarginDeg = (zeta: number) =>
  (Math.atan((2 * zeta) / Math.sqrt(Math.sqrt(1 + 4 * zeta ** 4) - 2 * zeta * zeta)) * 180) / Math.PI;

/** Every gate threshold switched off, so one criterion can be tested alone. */
export const NO_THRESHOLDS = {
  minGainMarginDb: null,
  minPhaseMarginDegrees: null,
  maxSensitivityPeak: null,
  maxComplementaryPeak: null,
  minDelayMarginSeconds: null,
  minDelayMarginMultiple: null,
};
