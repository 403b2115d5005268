import { z } from 'zod';
import { requestHashField } from './common.js';
import { TimeResponseSchema } from './time-response.js';
import { sampledAnalysisSchema } from './sampled-analysis.js';

const freq = z.number().describe('rad/s');
const complexNumber = z.object({ re: z.number(), im: z.number() });

export const WarningSchema = z
  .object({
    code: z.string(),
    message: z.string(),
    value: z.number().nullable(),
    limit: z.number().nullable(),
    source: z.string().describe('Published reference of the threshold, or "common practice"'),
  })
  .meta({ id: 'Warning' });

const PeakSchema = z.object({
  value: z.number(),
  db: z.number(),
  frequency: z.number().nullable().describe('rad/s; 0 for a supremum at zero frequency, null when approached as ω → ∞'),
});

const band = (unit: string, what: string) =>
  z.object({ [unit]: z.number().nullable() }).optional().describe(what);
const interpolationError = (unit: string) => band(unit, 'Measured data only: |linear − cubic interpolation| of this figure');
const uncertainty = (unit: string) => band(unit, 'Measured data with coherence and averages: two-standard-deviation random-error band (Bendat & Piersol)');

export const MarginsSchema = z
  .object({
    gain: z
      .object({ ratio: z.number(), db: z.number(), frequency: freq, interpolationError: interpolationError('db'), uncertainty: uncertainty('db') })
      .nullable(),
    phase: z
      .object({ degrees: z.number(), frequency: freq, interpolationError: interpolationError('degrees'), uncertainty: uncertainty('degrees') })
      .nullable(),
    delay: z
      .object({ seconds: z.number(), frequency: freq, interpolationError: interpolationError('seconds'), uncertainty: uncertainty('seconds') })
      .nullable(),
    gainCrossovers: z.array(z.object({ frequency: freq, phaseMarginDegrees: z.number(), delayMarginSeconds: z.number().nullable() })),
    phaseCrossovers: z.array(z.object({ frequency: freq, ratio: z.number(), db: z.number() })),
  })
  .meta({ id: 'Margins' });

export const StabilitySchema = z
  .object({
    closedLoopStable: z.boolean(),
    openLoopUnstablePoles: z.number().int(),
    openLoopUnstablePolesAssumed: z.boolean(),
    integrators: z.number().int(),
    imaginaryAxisPoles: z.array(z.object({ frequency: freq, order: z.number().int() })),
    method: z.enum(['nyquist-and-roots', 'nyquist']),
    nyquist: z.object({
      clockwiseEncirclements: z.number().int(),
      closedLoopUnstablePoles: z.number().int(),
      sweepTo: freq,
      closestApproachToCritical: z.number().describe('min |1 + L| on the sweep'),
    }),
    closedLoopPoles: z.array(complexNumber).optional(),
  })
  .meta({ id: 'Stability' });

const Curve = z.object({ magnitudeDb: z.array(z.number()), phaseDeg: z.array(z.number()) });

export const FrequencyResponseSchema = z
  .object({
    frequency: z.array(z.number()),
    loop: Curve.extend({ real: z.array(z.number()), imag: z.array(z.number()) }),
    sensitivity: Curve,
    complementarySensitivity: Curve,
  })
  .meta({ id: 'FrequencyResponse' });

export const AnalysisResponseSchema = z
  .object({
    version: z.string(),
    requestHash: requestHashField,
    stability: StabilitySchema,
    margins: MarginsSchema,
    peaks: z.object({ sensitivity: PeakSchema, complementarySensitivity: PeakSchema }),
    bandwidth: z.object({ closedLoop: freq.nullable(), sensitivity: freq.nullable(), crossover: freq.nullable() }),
    warnings: z.array(WarningSchema),
    grid: z.object({ min: freq, max: freq, points: z.number().int() }).describe('The refined analysis grid'),
    caution: z.string(),
    measurement: z
      .object({
        band: z.object({ min: freq, max: freq, points: z.number().int() }),
        interpolation: z.string(),
        interpolationError: z.object({
          gainMarginDb: z.number().nullable(),
          phaseMarginDegrees: z.number().nullable(),
          delayMarginSeconds: z.number().nullable(),
          sensitivityPeak: z.number(),
          complementaryPeak: z.number(),
        }),
        uncertainty: z
          .object({
            standardDeviations: z.number(),
            gainMarginDb: z.number().nullable(),
            phaseMarginDegrees: z.number().nullable(),
            delayMarginSeconds: z.number().nullable(),
          })
          .nullable(),
        averages: z.number().nullable(),
      })
      .optional()
      .describe('Measured plants only: how far the figures can be trusted'),
    response: FrequencyResponseSchema.optional(),
    sampled: sampledAnalysisSchema(MarginsSchema, FrequencyResponseSchema)
      .optional()
      .describe('Sampled loops only (controller.implementation, or a plant in z): the loop as the firmware runs it'),
    timeResponse: TimeResponseSchema.optional().describe('Present when the request asked for timeResponse and the plant is rational'),
  })
  .meta({ id: 'AnalysisResponse' });

export type AnalysisResponse = z.infer<typeof AnalysisResponseSchema>;

export const ErrorResponseSchema = z
  .object({
    statusCode: z.number().int(),
    code: z.string().describe('Stable code from the error catalogue'),
    message: z.string(),
    issues: z.array(z.object({ path: z.array(z.union([z.string(), z.number()])), message: z.string() })).optional(),
  })
  .meta({ id: 'Error' });
