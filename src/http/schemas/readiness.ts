import { z } from 'zod';

export const ReadinessSchema = z
  .object({
    status: z.literal('ready'),
    version: z.string(),
    computeWorkers: z.number().int().describe('Worker threads for analyses (0: inline).'),
    computeWaiting: z.number().int().describe("Computations accepted but not yet computing: queued, or in a busy worker's inbox."),
  })
  .meta({ id: 'Readiness', description: 'Ready to take work: not shutting down, not shedding load.' });
