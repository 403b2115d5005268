/** What GET /v1/criteria answers: the criteria, the profiles, and what fails under all of them. */
import type { CriteriaProfilesResponse } from '../contract/schemas/criteria-profiles.js';
import { VERSION } from '../version.js';
import { CRITERIA_PROFILES, CRITERION_DESCRIPTIONS, DEFAULT_PROFILE, GATE_CRITERIA, type ProfileName } from './criteria-profiles.js';

export function describeCriteria(): CriteriaProfilesResponse {
  return {
    version: VERSION,
    defaultProfile: DEFAULT_PROFILE,
    alwaysFails:
      'An unstable closed loop (Nyquist criterion Z = N + P, cross-checked by the closed-loop roots where the loop is rational) fails under every profile and every override.',
    criteria: GATE_CRITERIA.map((name) => ({ name, ...CRITERION_DESCRIPTIONS[name] })),
    profiles: CRITERIA_PROFILES.map((p) => ({ ...p, name: p.name as ProfileName, limits: { ...p.limits } })),
  };
}
