import { z } from 'zod';
import { requestHashField } from './common.js';
import { GATE_LIMITS } from '../../gate/limits.js';
import { PROFILE_NAMES } from '../../gate/criteria-profiles.js';
import { PlantSchema } from './analysis-request.js';
import { MarginsSchema } from './analysis-response.js';
import { ControllerSchema } from './controller.js';
import { GateCriteriaSchema } from './criteria-profiles.js';

export const CheckLoopSchema = z
  .object({
    name: z.string().min(1).max(GATE_LIMITS.maxNameLength).describe('Unique within the request; names the JUnit test case'),
    plant: PlantSchema,
    controller: ControllerSchema.optional().describe('Without a controller the plant is the loop transfer function.'),
    criteria: GateCriteriaSchema.optional().describe(
      "This loop's criteria: with a profile it stands alone; without one its limits are laid over the request's criteria.",
    ),
  })
  .strict()
  .meta({ id: 'CheckLoop', description: 'One loop to judge.' });

export const CheckRequestSchema = z
  .object({
    criteria: GateCriteriaSchema.optional(),
    loops: z.array(CheckLoopSchema).min(1).max(GATE_LIMITS.maxLoops),
  })
  .strict()
  .meta({
    id: 'CheckRequest',
    description: `Up to ${GATE_LIMITS.maxLoops} loops to judge against a criteria profile. A loop that cannot be analysed makes the whole request 4xx, with issues[].path starting ['loops', i].`,
  });

export type CheckRequest = z.infer<typeof CheckRequestSchema>;
export type CheckLoop = z.infer<typeof CheckLoopSchema>;

export const VerdictSchema = z.enum(['pass', 'warn', 'fail']).meta({ id: 'Verdict', description: 'fail beats warn beats pass.' });

export const FindingSchema = z
  .object({
    code: z.string().describe('Stable code, as in the analysis warnings'),
    message: z.string(),
    value: z.number().nullable(),
    limit: z.number().nullable(),
    source: z.string().describe('Published reference of the threshold, "common practice", or "set by the caller"'),
    severity: z.enum(['fail', 'warn']),
    criterion: z.string().nullable().describe('The criterion breached; null for stability and analysis cautions'),
  })
  .meta({ id: 'Finding', description: 'Why a loop fails or warns.' });

const PeakSummary = z.object({ value: z.number(), db: z.number(), frequency: z.number().nullable() });

export const LoopSummarySchema = z
  .object({
    closedLoopStable: z.boolean(),
    margins: MarginsSchema.pick({ gain: true, phase: true, delay: true }),
    peaks: z.object({ sensitivity: PeakSummary, complementarySensitivity: PeakSummary }),
    bandwidth: z.object({ closedLoop: z.number().nullable(), sensitivity: z.number().nullable(), crossover: z.number().nullable() }),
    loopDelaySeconds: z.number().nullable().describe("The loop's pure delay; null when the plant kind does not state it"),
  })
  .meta({ id: 'LoopSummary', description: 'The figures a verdict rests on.' });

export const LoopCheckSchema = z
  .object({
    name: z.string(),
    verdict: VerdictSchema,
    profile: z.enum(PROFILE_NAMES),
    overridden: z.array(z.string()).describe('Criteria whose limit or severity the request changed from the profile'),
    findings: z.array(FindingSchema),
    summary: LoopSummarySchema,
  })
  .meta({ id: 'LoopCheck' });

export const CheckResponseSchema = z
  .object({
    version: z.string(),
    requestHash: requestHashField,
    verdict: VerdictSchema,
    profile: z.enum(PROFILE_NAMES).describe("The request's profile (a loop may name its own)"),
    counts: z.object({ pass: z.number().int(), warn: z.number().int(), fail: z.number().int() }),
    loops: z.array(LoopCheckSchema),
    caution: z.string(),
  })
  .meta({ id: 'CheckResponse', description: 'The verdict of every loop and of the batch.' });

export type CheckResponse = z.infer<typeof CheckResponseSchema>;
export type LoopCheck = z.infer<typeof LoopCheckSchema>;
export type Finding = z.infer<typeof FindingSchema>;
export type Verdict = z.infer<typeof VerdictSchema>;
export type LoopSummary = z.infer<typeof LoopSummarySchema>;
