import { z } from 'zod';

const freq = z.number().describe('rad/s');
const complexNumber = z.object({ re: z.number(), im: z.number() });
const peak = z.object({
  value: z.number(),
  db: z.number(),
  frequency: z.number().nullable().describe('rad/s; 0 for a supremum at zero frequency; the Nyquist frequency is a true maximum'),
});

/**
 * The `sampled` block of the analysis answer. Built from the shared margin
 * and response schemas, passed in by analysis-response.ts (which owns them)
 * so that the two modules do not import each other.
 */
export function sampledAnalysisSchema<M extends z.ZodType, R extends z.ZodType>(margins: M, response: R) {
  return z
    .object({
      samplePeriod: z.number().describe('Ts, seconds'),
      nyquistFrequency: freq.describe('π/Ts, rad/s: the sampled loop is examined on (0, π/Ts]'),
      samplingFrequency: freq.describe('2π/Ts, rad/s'),
      implementation: z.object({
        method: z.enum(['tustin', 'tustin-prewarp', 'backward-euler', 'forward-euler']).nullable().describe('null without a controller'),
        prewarpFrequency: freq.nullable(),
        computationDelay: z.number().describe('seconds'),
      }),
      plant: z
        .enum(['zero-order-hold-exact', 'given-in-z', 'hold-response-without-aliasing'])
        .describe(
          'zero-order-hold-exact: the continuous plant behind a zero-order hold, sampled exactly (fractional delays by the modified z-transform); hold-response-without-aliasing: measured data or an expression, C(e^{jωTs})·H(jω)·P(jω) with the hold response H, aliasing neglected',
        ),
      stability: z.object({
        closedLoopStable: z.boolean(),
        openLoopUnstablePoles: z.number().int().describe('Open-loop poles outside the unit circle'),
        integrators: z.number().int().describe('Open-loop poles at z = 1'),
        unitCirclePoles: z.array(z.object({ frequency: freq, order: z.number().int() })).describe('Other open-loop poles on the unit circle, at arg(z)/Ts'),
        method: z.enum(['unit-circle-nyquist-and-roots', 'unit-circle-nyquist']),
        nyquist: z.object({
          clockwiseEncirclements: z.number().int(),
          closedLoopUnstablePoles: z.number().int(),
          closestApproachToCritical: z.number().describe('min |1 + L(e^{jωTs})|'),
        }),
        closedLoopPoles: z.array(complexNumber).optional().describe('Roots in z of the characteristic polynomial, largest modulus first'),
        largestClosedLoopPoleMagnitude: z.number().optional().describe('Stable when below 1'),
      }),
      margins,
      peaks: z.object({ sensitivity: peak, complementarySensitivity: peak }),
      bandwidth: z.object({ closedLoop: freq.nullable(), sensitivity: freq.nullable(), crossover: freq.nullable() }),
      grid: z.object({ min: freq, max: freq, points: z.number().int() }),
      continuousDesign: z
        .object({
          continuousPhaseMarginDegrees: z.number().nullable(),
          sampledPhaseMarginDegrees: z.number().nullable(),
          phaseMarginChangeDegrees: z.number().nullable().describe('sampled − continuous'),
          continuousGainMarginDb: z.number().nullable(),
          sampledGainMarginDb: z.number().nullable(),
          crossoverFrequency: freq.nullable().describe('ωc of the continuous design'),
          phaseLostAtCrossoverDegrees: z.number().nullable().describe('∠L(jωc) − ∠L(e^{jωcTs}); positive is a lag'),
          magnitudeChangeAtCrossoverDb: z.number().nullable(),
          holdAndDelayEstimateDegrees: z.number().nullable().describe('ωc·(Ts/2 + computation delay): the hold and delay alone'),
        })
        .nullable()
        .describe('The continuous design beside the sampled loop; null for a plant given in z'),
      controller: z
        .object({
          numerator: z.array(z.number()).describe('Descending powers of z'),
          denominator: z.array(z.number()).describe('Descending powers of z'),
          poles: z.array(complexNumber),
          zeros: z.array(complexNumber),
          unstablePoles: z.number().int().describe('Poles of the discretised controller outside the unit circle'),
          gainAtNyquistFrequency: z.object({
            ratio: z.number().nullable().describe('|C(e^{jπ})|; null when infinite (a pole at z = −1)'),
            db: z.number().nullable(),
            relativeToProportional: z.number().nullable().describe('|C(e^{jπ})|/|kp|; null when kp = 0 or infinite'),
          }),
        })
        .nullable(),
      plantModel: z
        .object({
          numerator: z.array(z.number()).describe('Descending powers of z'),
          denominator: z.array(z.number()).describe('Descending powers of z'),
          delaySamples: z.number().int().describe('Extra factor z^(−delaySamples)'),
        })
        .nullable()
        .describe('The plant the controller sees, in z; null when it has no rational model'),
      sampleRate: z.object({
        samplesPerBandwidth: z.number().nullable().describe('(2π/Ts)/bandwidth; 10–30 is common practice'),
        bandwidth: freq.nullable(),
        bandwidthOf: z.string().nullable(),
      }),
      noise: z
        .object({
          quantisationStep: z.number(),
          measurementNoiseRms: z.number().describe('q/√12'),
          noiseGain: z.number().nullable().describe('‖C·S‖₂: RMS gain from measurement noise to actuator; null when the sampled loop is unstable'),
          actuatorNoiseRms: z.number().nullable(),
          converged: z.boolean(),
        })
        .nullable()
        .describe('Given measurementNoise: the actuator noise it causes'),
      notes: z.array(z.string()),
      response: response.optional().describe('L, S, T on the unit circle up to π/Ts'),
    })
    .meta({ id: 'SampledAnalysis', description: 'The loop as the firmware runs it: sampled controller, held and sampled plant.' });
}
