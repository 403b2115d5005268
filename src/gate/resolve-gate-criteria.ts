/**
 * A request's criteria → the limits one loop is judged by.
 *
 * A loop's own criteria that name a profile stand alone (that profile plus
 * the loop's overrides). Without a profile they are laid over the request's
 * criteria, which are laid over the request's profile (default baseline).
 */
import type { GateCriteriaRequest } from '../contract/schemas/criteria-profiles.js';
import {
  DEFAULT_PROFILE,
  GATE_CRITERIA,
  SOURCE_SET_BY_CALLER,
  profileNamed,
  type GateCriterion,
  type GateLimits,
  type ProfileName,
} from './criteria-profiles.js';

export interface ResolvedCriteria {
  profile: ProfileName;
  limits: GateLimits;
  /** Criteria whose limit or severity differs from the profile's by request. */
  overridden: GateCriterion[];
}

function layer(base: ResolvedCriteria, over: GateCriteriaRequest | undefined): ResolvedCriteria {
  if (!over) return base;
  const limits = { ...base.limits };
  const overridden = new Set(base.overridden);
  for (const key of GATE_CRITERIA) {
    const value = over[key];
    const severity = over.severity?.[key];
    if (value === undefined && severity === undefined) continue;
    limits[key] = {
      value: value === undefined ? limits[key].value : value,
      severity: severity ?? limits[key].severity,
      source: value === undefined ? limits[key].source : SOURCE_SET_BY_CALLER,
    };
    overridden.add(key);
  }
  return { profile: base.profile, limits, overridden: GATE_CRITERIA.filter((k) => overridden.has(k)) };
}

const fromProfile = (name: ProfileName): ResolvedCriteria => ({ profile: name, limits: { ...profileNamed(name).limits }, overridden: [] });

export function resolveGateCriteria(request: GateCriteriaRequest | undefined, loop?: GateCriteriaRequest): ResolvedCriteria {
  if (loop?.profile) return layer(fromProfile(loop.profile), loop);
  return layer(layer(fromProfile(request?.profile ?? DEFAULT_PROFILE), request), loop);
}
