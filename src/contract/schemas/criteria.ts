import { z } from 'zod';

export const CriteriaOverridesSchema = z
  .object({
    minGainMarginDb: z.number().min(0).optional().describe('Smallest acceptable |gain margin|, dB (default 6)'),
    minPhaseMarginDegrees: z.number().optional().describe('Smallest acceptable phase margin, degrees (default 30)'),
    maxSensitivityPeak: z.number().min(1).optional().describe('Largest acceptable Ms (default 2)'),
    maxComplementaryPeak: z.number().min(0).optional().describe('Largest acceptable Mt (default 1.25)'),
    minDelayMarginSeconds: z.number().min(0).nullable().optional().describe('Smallest acceptable delay margin, s (default none)'),
  })
  .strict()
  .meta({ id: 'CriteriaOverrides', description: 'Overrides of the robustness thresholds.' });
