/**
 * Robustness criteria: the limits the warnings (and the review gate) test
 * against, each with the published source of its default.
 */
export interface Criteria {
  /** Smallest acceptable |gain margin| in dB. */
  minGainMarginDb: number;
  /** Smallest acceptable phase margin in degrees. */
  minPhaseMarginDegrees: number;
  /** Largest acceptable sensitivity peak Ms. */
  maxSensitivityPeak: number;
  /** Largest acceptable complementary sensitivity peak Mt. */
  maxComplementaryPeak: number;
  /** Smallest acceptable delay margin in seconds (none by default). */
  minDelayMarginSeconds: number | null;
}

export const SKOGESTAD_POSTLETHWAITE = 'Skogestad & Postlethwaite, Multivariable Feedback Control, 2nd ed., §2.4.3';

export const DEFAULT_CRITERIA: Criteria = {
  minGainMarginDb: 6, // GM > 2 ≈ 6.02 dB, rounded to 6 dB as usually quoted
  minPhaseMarginDegrees: 30,
  maxSensitivityPeak: 2,
  maxComplementaryPeak: 1.25,
  minDelayMarginSeconds: null,
};

/** Where each default limit comes from. */
export const CRITERIA_SOURCES: Record<keyof Criteria, string> = {
  minGainMarginDb: `${SKOGESTAD_POSTLETHWAITE}: typically GM > 2 (6 dB) (from memory)`,
  minPhaseMarginDegrees: `${SKOGESTAD_POSTLETHWAITE}: typically PM > 30° (from memory)`,
  maxSensitivityPeak: `${SKOGESTAD_POSTLETHWAITE}: Ms below about 2 (6 dB) (from memory)`,
  maxComplementaryPeak: `${SKOGESTAD_POSTLETHWAITE}: Mt below about 1.25 (2 dB) (from memory)`,
  minDelayMarginSeconds: 'set by the caller',
};

export function resolveCriteria(overrides: Partial<Criteria> = {}): Criteria {
  const out = { ...DEFAULT_CRITERIA };
  for (const key of Object.keys(DEFAULT_CRITERIA) as (keyof Criteria)[]) {
    if (overrides[key] !== undefined) (out as Record<string, unknown>)[key] = overrides[key];
  }
  return out;
}
