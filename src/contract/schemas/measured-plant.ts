import { z } from 'zod';
import { num } from './common.js';

const column = (what: string) => z.array(num).describe(what);

export const FrequencyResponsePlantSchema = z
  .object({
    kind: z.literal('frequency-response'),
    frequency: column('Measured frequencies, increasing, > 0').optional(),
    magnitude: column('|P| (absolute or dB per magnitudeUnit)').optional(),
    phase: column('Phase of P (deg or rad per phaseUnit)').optional(),
    real: column('Re P (instead of magnitude/phase)').optional(),
    imag: column('Im P (instead of magnitude/phase)').optional(),
    csv: z.string().describe('The same columns as text with a header row: frequency,magnitude,phase or frequency,real,imag, optionally coherence').optional(),
    frequencyUnit: z.enum(['rad/s', 'Hz']).optional().describe('default rad/s'),
    magnitudeUnit: z.enum(['absolute', 'dB']).optional().describe('default absolute'),
    phaseUnit: z.enum(['deg', 'rad']).optional().describe('default deg'),
    coherence: column('Magnitude-squared coherence γ² of an H1 estimate, 0..1').optional(),
    averages: z.number().int().min(1).optional().describe('Number of averaged segments nd of the estimate (needed for the uncertainty band)'),
    openLoopUnstablePoles: z.number().int().min(0).max(1000).optional().describe('Right-half-plane poles of the plant (default 0, with a warning)'),
    integrators: z.number().int().min(0).max(4).optional().describe('Poles of the plant at s = 0 (default 0)'),
  })
  .strict()
  .meta({ id: 'FrequencyResponsePlant', description: 'A plant given as measured frequency-response data (interpolated in log-frequency).' });
