import { z } from 'zod';
import { ControllerSchema } from './controller.js';
import { MeasurementNoiseSchema } from './controller-implementation.js';
import { CriteriaOverridesSchema } from './criteria.js';
import { ParametricPlantSchemas } from './plant.js';
import { FrequencyResponsePlantSchema } from './measured-plant.js';
import { TimeResponseOptionsSchema } from './time-response.js';

export const PlantSchema = z
  .discriminatedUnion('kind', [...ParametricPlantSchemas, FrequencyResponsePlantSchema])
  .meta({ id: 'Plant', description: 'The plant, by kind.' });

export const FrequencyGridSchema = z
  .object({
    min: z.number().describe('rad/s, > 0'),
    max: z.number().describe('rad/s, > min'),
    points: z.number().int().min(2).describe('Number of log-spaced points (at most 20,000)'),
  })
  .strict()
  .meta({ id: 'FrequencyGrid', description: 'Log-spaced response grid.' });

export const AnalysisRequestSchema = z
  .object({
    plant: PlantSchema,
    controller: ControllerSchema.optional().describe('Without a controller the plant is the loop transfer function.'),
    frequency: FrequencyGridSchema.optional(),
    criteria: CriteriaOverridesSchema.optional(),
    detail: z.enum(['full', 'summary']).optional().describe('summary omits the response arrays (default full)'),
    measurementNoise: MeasurementNoiseSchema.optional().describe('Sampled loops: A/D quantisation, for the actuator noise it causes.'),
    timeResponse: TimeResponseOptionsSchema.optional().describe('Adds closed-loop setpoint and load-step responses (rational plants).'),
  })
  .strict()
  .meta({ id: 'AnalysisRequest', description: 'A loop to analyse: plant, optional PID controller, options.' });

export type AnalysisRequest = z.infer<typeof AnalysisRequestSchema>;
