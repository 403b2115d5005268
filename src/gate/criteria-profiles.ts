/**
 * Named profiles of review thresholds. Each limit carries its value, whether
 * a breach fails the loop or only warns, and where the number comes from.
 * The names are our own. An unstable closed loop fails under every profile;
 * that is not a threshold and cannot be switched off.
 */
import { CRITERIA_SOURCES, DEFAULT_CRITERIA, SKOGESTAD_POSTLETHWAITE } from '../analysis/criteria.js';

export type Severity = 'fail' | 'warn';

/** Every threshold the gate knows; the first five are the analysis' own criteria. */
export const GATE_CRITERIA = [
  'minGainMarginDb',
  'minPhaseMarginDegrees',
  'maxSensitivityPeak',
  'maxComplementaryPeak',
  'minDelayMarginSeconds',
  'minDelayMarginMultiple',
] as const;

export type GateCriterion = (typeof GATE_CRITERIA)[number];

export interface Limit {
  /** null: the criterion is not checked. */
  value: number | null;
  severity: Severity;
  source: string;
}

export type GateLimits = Record<GateCriterion, Limit>;

export interface CriteriaProfile {
  name: string;
  summary: string;
  usedFor: string;
  limits: GateLimits;
}

export const CRITERION_DESCRIPTIONS: Record<GateCriterion, { description: string; unit: string }> = {
  minGainMarginDb: { description: 'Smallest acceptable |gain margin| (the phase crossover nearest to instability).', unit: 'dB' },
  minPhaseMarginDegrees: { description: 'Smallest acceptable phase margin (the smallest over all gain crossovers).', unit: 'degrees' },
  maxSensitivityPeak: { description: 'Largest acceptable sensitivity peak Ms = max |1/(1 + L)|.', unit: 'ratio' },
  maxComplementaryPeak: { description: 'Largest acceptable complementary sensitivity peak Mt = max |L/(1 + L)|.', unit: 'ratio' },
  minDelayMarginSeconds: { description: 'Smallest acceptable delay margin (extra delay the loop tolerates before instability).', unit: 's' },
  minDelayMarginMultiple: {
    description: "Smallest acceptable delay margin as a multiple of the loop's own delay (1: the loop stays stable if its delay doubles).",
    unit: 'multiple of the loop delay',
  },
};

const CALLER = 'set by the caller';
const UNSET = 'not checked in this profile';
const COMMON = 'common practice';

/** Gain margin guaranteed by a sensitivity peak: GM ≥ Ms/(Ms − 1) (Skogestad & Postlethwaite §2.4.3), in dB. */
export function gainMarginDbImpliedBy(ms: number): number {
  return 20 * Math.log10(ms / (ms - 1));
}

/** Phase margin guaranteed by a sensitivity peak: PM ≥ 2·asin(1/(2·Ms)) (Skogestad & Postlethwaite §2.4.3), in degrees. */
export function phaseMarginDegreesImpliedBy(ms: number): number {
  return (2 * Math.asin(1 / (2 * ms)) * 180) / Math.PI;
}

const unset = (severity: Severity = 'fail'): Limit => ({ value: null, severity, source: UNSET });

const textbook: GateLimits = {
  minGainMarginDb: { value: DEFAULT_CRITERIA.minGainMarginDb, severity: 'fail', source: CRITERIA_SOURCES.minGainMarginDb },
  minPhaseMarginDegrees: { value: DEFAULT_CRITERIA.minPhaseMarginDegrees, severity: 'fail', source: CRITERIA_SOURCES.minPhaseMarginDegrees },
  maxSensitivityPeak: { value: DEFAULT_CRITERIA.maxSensitivityPeak, severity: 'fail', source: CRITERIA_SOURCES.maxSensitivityPeak },
  // Mt is mostly about set-point overshoot and noise; Ms is the robustness figure, so a high Mt only warns.
  maxComplementaryPeak: {
    value: DEFAULT_CRITERIA.maxComplementaryPeak,
    severity: 'warn',
    source: `${CRITERIA_SOURCES.maxComplementaryPeak}; a warning only, since Mt speaks of overshoot and noise more than of robustness (common practice)`,
  },
  minDelayMarginSeconds: unset(),
  minDelayMarginMultiple: unset(),
};

const ROBUST_MS = 1.4;
const ASTROM_HAGGLUND = 'Åström & Hägglund, Advanced PID Control, ISA 2006';

export const CRITERIA_PROFILES: readonly CriteriaProfile[] = [
  {
    name: 'baseline',
    summary: 'The textbook minimums of robustness.',
    usedFor:
      'Every loop, unless it has a reason for another profile: a loop below these limits is fragile against ordinary modelling error. The default.',
    limits: textbook,
  },
  {
    name: 'plant-changes',
    summary: `Ms ≤ ${ROBUST_MS}, with the gain and phase margins that bound implies.`,
    usedFor:
      'Loops that must keep working while the plant changes: gain that moves with operating point, wear or product (the filler pump as viscosity changes, the pasteuriser as its heat exchanger fouls).',
    limits: {
      ...textbook,
      maxSensitivityPeak: { value: ROBUST_MS, severity: 'fail', source: `${ASTROM_HAGGLUND}: Ms ≈ 1.4 for robust tuning (from memory)` },
      minGainMarginDb: {
        value: gainMarginDbImpliedBy(ROBUST_MS),
        severity: 'fail',
        source: `implied by Ms ≤ ${ROBUST_MS} through GM ≥ Ms/(Ms − 1) = 3.5 (${SKOGESTAD_POSTLETHWAITE}); listed so that a failing loop names its gain margin`,
      },
      minPhaseMarginDegrees: {
        value: phaseMarginDegreesImpliedBy(ROBUST_MS),
        severity: 'fail',
        source: `implied by Ms ≤ ${ROBUST_MS} through PM ≥ 2·asin(1/(2·Ms)) ≈ 41.85° (${SKOGESTAD_POSTLETHWAITE}); listed so that a failing loop names its phase margin`,
      },
    },
  },
  {
    name: 'uncertain-delay',
    summary: 'The baseline, and a delay margin at least as long as the loop delay itself.',
    usedFor:
      "Loops whose dead time is known only roughly (transport delays that change with flow, delays read off a step test): the loop must stay stable if its delay doubles. Needs a plant kind that states its delay; for others give minDelayMarginSeconds.",
    limits: {
      ...textbook,
      minDelayMarginMultiple: {
        value: 1,
        severity: 'fail',
        source: `${COMMON}: a dead time estimated from a step test may be off by tens of percent; tolerating its doubling covers that`,
      },
    },
  },
  {
    name: 'advisory',
    summary: 'The baseline limits as warnings only: just an unstable closed loop fails.',
    usedFor: 'Commissioning and exploratory reviews, where a fragile tuning should be seen but not block the pipeline.',
    limits: Object.fromEntries(
      Object.entries(textbook).map(([k, l]) => [k, { ...l, severity: 'warn' as Severity }]),
    ) as GateLimits,
  },
];

export const PROFILE_NAMES = ['baseline', 'plant-changes', 'uncertain-delay', 'advisory'] as const;
export type ProfileName = (typeof PROFILE_NAMES)[number];
export const DEFAULT_PROFILE: ProfileName = 'baseline';

export function profileNamed(name: ProfileName): CriteriaProfile {
  const p = CRITERIA_PROFILES.find((q) => q.name === name);
  if (!p) throw new Error(`No criteria profile "${name}"`);
  return p;
}

export const SOURCE_SET_BY_CALLER = CALLER;
