import { z } from 'zod';
import { PROFILE_NAMES } from '../../gate/criteria-profiles.js';

const severity = z.enum(['fail', 'warn']);
const nullable = (s: z.ZodNumber, description: string) => s.nullable().optional().describe(`${description}; null: not checked`);

export const SeveritySchema = severity.meta({ id: 'Severity', description: 'fail: a breach fails the loop; warn: it only warns.' });

export const GateCriteriaSchema = z
  .object({
    profile: z.enum(PROFILE_NAMES).optional().describe('A named profile of GET /v1/criteria (default baseline)'),
    minGainMarginDb: nullable(z.number().min(0), 'Smallest acceptable |gain margin|, dB'),
    minPhaseMarginDegrees: nullable(z.number().min(-180).max(180), 'Smallest acceptable phase margin, degrees'),
    maxSensitivityPeak: nullable(z.number().min(1), 'Largest acceptable Ms'),
    maxComplementaryPeak: nullable(z.number().min(0), 'Largest acceptable Mt'),
    minDelayMarginSeconds: nullable(z.number().min(0), 'Smallest acceptable delay margin, s'),
    minDelayMarginMultiple: nullable(z.number().min(0), "Smallest acceptable delay margin as a multiple of the loop's delay"),
    severity: z
      .object({
        minGainMarginDb: SeveritySchema.optional(),
        minPhaseMarginDegrees: SeveritySchema.optional(),
        maxSensitivityPeak: SeveritySchema.optional(),
        maxComplementaryPeak: SeveritySchema.optional(),
        minDelayMarginSeconds: SeveritySchema.optional(),
        minDelayMarginMultiple: SeveritySchema.optional(),
      })
      .strict()
      .optional()
      .describe("Overrides of the profile's severity per criterion"),
  })
  .strict()
  .meta({
    id: 'GateCriteria',
    description: 'A criteria profile by name, with single limits (and severities) overridden. Limits set here cite "set by the caller" as their source.',
  });

export type GateCriteriaRequest = z.infer<typeof GateCriteriaSchema>;

const LimitSchema = z.object({
  value: z.number().nullable().describe('null: not checked'),
  severity,
  source: z.string().describe('Published source of the number, or "common practice"'),
});

export const CriteriaProfileSchema = z
  .object({
    name: z.enum(PROFILE_NAMES),
    summary: z.string(),
    usedFor: z.string(),
    limits: z.object({
      minGainMarginDb: LimitSchema,
      minPhaseMarginDegrees: LimitSchema,
      maxSensitivityPeak: LimitSchema,
      maxComplementaryPeak: LimitSchema,
      minDelayMarginSeconds: LimitSchema,
      minDelayMarginMultiple: LimitSchema,
    }),
  })
  .meta({ id: 'CriteriaProfile', description: 'A named set of thresholds, with severity and source beside each.' });

export const CriteriaProfilesResponseSchema = z
  .object({
    version: z.string(),
    defaultProfile: z.enum(PROFILE_NAMES),
    alwaysFails: z.string().describe('What fails a loop under every profile'),
    criteria: z.array(z.object({ name: z.string(), description: z.string(), unit: z.string() })),
    profiles: z.array(CriteriaProfileSchema),
  })
  .meta({ id: 'CriteriaProfiles', description: 'The criteria profiles that POST /v1/checks and /v1/comparisons accept.' });

export type CriteriaProfilesResponse = z.infer<typeof CriteriaProfilesResponseSchema>;
