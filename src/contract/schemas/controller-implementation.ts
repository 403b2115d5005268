import { z } from 'zod';

const common = {
  samplePeriod: z.number().positive().describe('Sample period Ts of the controller (seconds, > 0)'),
  computationDelay: z
    .number()
    .describe('Time from sampling the measurement to updating the actuator (seconds, ≥ 0; default 0; one sample, = Ts, is common)')
    .optional(),
};

export const DISCRETISATION_METHODS = ['tustin', 'tustin-prewarp', 'backward-euler', 'forward-euler'] as const;

export const ControllerImplementationSchema = z
  .discriminatedUnion('method', [
    z
      .object({
        ...common,
        method: z.enum(['tustin', 'backward-euler', 'forward-euler']).describe('s → (2/Ts)(z−1)/(z+1), (z−1)/(Ts·z) or (z−1)/Ts'),
      })
      .strict(),
    z
      .object({
        ...common,
        method: z.literal('tustin-prewarp').describe('s → (ω0/tan(ω0Ts/2))(z−1)/(z+1): exact at ω0'),
        prewarpFrequency: z.number().positive().describe('ω0 in rad/s, below the Nyquist frequency π/Ts'),
      })
      .strict(),
  ])
  .meta({
    id: 'ControllerImplementation',
    description:
      'The controller runs as a difference equation at sample period Ts behind a zero-order hold: its frequency response is taken at z = e^{jωTs} from the discretised form (derivative filter included).',
  });

export const MeasurementNoiseSchema = z
  .object({
    quantisationStep: z.number().positive().describe('A/D quantisation step q in measurement units; noise of standard deviation q/√12'),
    actuatorNoiseLimit: z.number().positive().optional().describe('Largest acceptable actuator noise (RMS, actuator units); a warning above it'),
  })
  .strict()
  .meta({ id: 'MeasurementNoise', description: 'Measurement noise of a sampled loop, for the actuator noise it causes through C·S.' });

/** Fields that make a transfer-function or zeros-poles plant discrete. */
export const discretePlantFields = {
  variable: z.enum(['s', 'z']).optional().describe('s (default): continuous time; z: a discrete plant with samplePeriod'),
  samplePeriod: z.number().positive().optional().describe('Sample period Ts (seconds) of a discrete plant; required with variable "z"'),
};

export const coefficientOrderField = {
  coefficientOrder: z
    .enum(['descending-powers-of-z', 'ascending-powers-of-inverse-z'])
    .optional()
    .describe(
      'Discrete plants only. descending-powers-of-z (default): coefficients of z^n ... z^0; ascending-powers-of-inverse-z: b0 + b1·z⁻¹ + ..., as in the difference equation a0·y_k + a1·y_{k−1} + ... = b0·u_k + b1·u_{k−1} + ...',
    ),
};
