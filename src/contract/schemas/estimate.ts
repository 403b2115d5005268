import { z } from 'zod';
import { requestHashField } from './common.js';
import { MAX_RECORD_SAMPLES } from '../../estimation/limits.js';
import { FrequencyResponsePlantSchema } from './measured-plant.js';

export const EstimateRequestSchema = z
  .object({
    sampleRate: z.number().describe('Samples per second, Hz'),
    input: z.array(z.number()).describe(`Excitation record u (at most ${MAX_RECORD_SAMPLES} samples)`),
    output: z.array(z.number()).describe('Response record y, same length'),
    segmentLength: z.number().int().optional().describe('Samples per segment, a power of two (default from the record length: at least 8 averages)'),
    overlap: z.number().optional().describe('Fraction shared by neighbouring segments, 0–0.9 (default 0.5)'),
    window: z.enum(['hann']).optional().describe('default hann (periodic)'),
    detrend: z.enum(['mean', 'linear', 'none']).optional().describe('default mean'),
  })
  .strict()
  .meta({ id: 'EstimateRequest', description: 'Input/output records of a rig test to estimate a frequency response from (Welch, H1).' });

export const EstimateResponseSchema = z
  .object({
    version: z.string(),
    requestHash: requestHashField,
    frequency: z.array(z.number()).describe('rad/s, 0 to the Nyquist frequency'),
    magnitude: z.array(z.number()),
    phase: z.array(z.number()).describe('degrees, unwrapped'),
    coherence: z.array(z.number()).describe('magnitude-squared coherence'),
    segments: z.number().int().describe('averaged segments nd'),
    segmentLength: z.number().int(),
    overlapSamples: z.number().int(),
    sampleRate: z.number(),
    window: z.string(),
    detrend: z.string(),
    method: z.string(),
    plant: FrequencyResponsePlantSchema.describe('Ready to post as the plant of /v1/analyses (DC bin left out)'),
  })
  .meta({ id: 'EstimateResponse' });
