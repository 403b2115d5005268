import { z } from 'zod';
import { requestHashField } from './common.js';
import { PROFILE_NAMES } from '../../gate/criteria-profiles.js';
import { PlantSchema } from './analysis-request.js';
import { AnalysisResponseSchema } from './analysis-response.js';
import { FindingSchema, VerdictSchema } from './checks.js';
import { ControllerSchema } from './controller.js';
import { GateCriteriaSchema } from './criteria-profiles.js';

export const ComparisonRequestSchema = z
  .object({
    plant: PlantSchema,
    baseline: ControllerSchema.describe('The tuning in service'),
    candidate: ControllerSchema.describe('The proposed tuning'),
    criteria: GateCriteriaSchema.optional(),
  })
  .strict()
  .meta({ id: 'ComparisonRequest', description: 'One plant, the tuning in service and a candidate.' });

export type ComparisonRequest = z.infer<typeof ComparisonRequestSchema>;

export const LoopAnalysisSummarySchema = AnalysisResponseSchema.omit({ version: true, requestHash: true, caution: true, response: true }).meta({
  id: 'LoopAnalysisSummary',
  description: 'An analysis without the response arrays (as POST /v1/analyses with detail "summary").',
});

const JudgedTuningSchema = z.object({
  verdict: VerdictSchema,
  findings: z.array(FindingSchema),
  analysis: LoopAnalysisSummarySchema,
});

export const FigureChangeSchema = z
  .object({
    baseline: z.number().nullable(),
    candidate: z.number().nullable(),
    change: z.number().nullable().describe('candidate − baseline; null when either does not exist'),
  })
  .meta({ id: 'FigureChange' });

export const FIGURES = [
  'gainMarginDb',
  'gainMarginRatio',
  'phaseCrossoverFrequency',
  'phaseMarginDegrees',
  'delayMarginSeconds',
  'crossoverFrequency',
  'sensitivityPeak',
  'complementarySensitivityPeak',
  'closedLoopBandwidth',
  'sensitivityBandwidth',
] as const;

export type Figure = (typeof FIGURES)[number];

export const ComparisonResponseSchema = z
  .object({
    version: z.string(),
    requestHash: requestHashField,
    profile: z.enum(PROFILE_NAMES),
    baseline: JudgedTuningSchema,
    candidate: JudgedTuningSchema,
    changes: z.object(Object.fromEntries(FIGURES.map((f) => [f, FigureChangeSchema])) as Record<Figure, typeof FigureChangeSchema>),
    caution: z.string(),
  })
  .meta({ id: 'ComparisonResponse', description: 'Both tunings analysed and judged, and the change in each figure.' });

export type ComparisonResponse = z.infer<typeof ComparisonResponseSchema>;
export type FigureChange = z.infer<typeof FigureChangeSchema>;
