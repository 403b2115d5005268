import { z } from 'zod';
import { PROFILE_NAMES } from '../../gate/criteria-profiles.js';
import { AnalysisRequestSchema } from './analysis-request.js';

export const ReportOptionsSchema = z
  .object({
    title: z.string().min(1).max(200).optional().describe('Heading of the report (default: "Loop review")'),
    profile: z.enum(PROFILE_NAMES).optional().describe('Criteria profile of GET /v1/criteria the figures are marked against (default baseline); the request\'s criteria override its limits'),
  })
  .strict()
  .meta({ id: 'ReportOptions', description: 'How the report is headed and which criteria profile marks the figures.' });

export const ReportRequestSchema = AnalysisRequestSchema.extend({
  report: ReportOptionsSchema.optional(),
})
  .strict()
  .meta({
    id: 'ReportRequest',
    description: 'An analysis request, plus report options. The request hash in the report is that of the body without `report`, so it equals the hash POST /v1/analyses gives the same loop.',
  });

export type ReportRequest = z.infer<typeof ReportRequestSchema>;
