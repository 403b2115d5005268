import { z } from 'zod';
import { num, time } from './common.js';
import { ControllerImplementationSchema } from './controller-implementation.js';

export const DerivativeFilterSchema = z
  .union([
    z.object({ n: z.number().positive().describe('Tf = Td/N; N typically 5–20') }).strict(),
    z.object({ timeConstant: time('Filter time constant') }).strict(),
  ])
  .meta({ id: 'DerivativeFilter', description: 'First-order filter on the derivative term: Tf = Td/N, or Tf given.' });

export const ParallelPidSchema = z
  .object({
    kind: z.literal('pid'),
    form: z.literal('parallel'),
    kp: num.optional().describe('Proportional gain (default 0)'),
    ki: num.optional().describe('Integral gain, 1/s (default 0)'),
    kd: num.optional().describe('Derivative gain, s (default 0)'),
    derivativeFilter: DerivativeFilterSchema.optional(),
    implementation: ControllerImplementationSchema.optional(),
  })
  .strict()
  .meta({ id: 'ParallelPid', description: 'C = kp + ki/s + kd·s/(1 + Tf·s).' });

const gainTimes = {
  kind: z.literal('pid'),
  gain: num.describe('Controller gain K'),
  integralTime: time('Integral time Ti; absent: no integral action').optional(),
  derivativeTime: time('Derivative time Td (default 0)').optional(),
  derivativeFilter: DerivativeFilterSchema.optional(),
  implementation: ControllerImplementationSchema.optional(),
};

export const StandardPidSchema = z
  .object({ ...gainTimes, form: z.literal('standard') })
  .strict()
  .meta({ id: 'StandardPid', description: 'C = K·(1 + 1/(Ti·s) + Td·s/(1 + Tf·s)).' });

export const SeriesPidSchema = z
  .object({ ...gainTimes, form: z.literal('series') })
  .strict()
  .meta({ id: 'SeriesPid', description: 'C = K·(1 + 1/(Ti·s))·(1 + Td·s)/(1 + Tf·s).' });

export const ControllerSchema = z
  .discriminatedUnion('form', [ParallelPidSchema, StandardPidSchema, SeriesPidSchema])
  .meta({ id: 'Controller', description: 'A PID controller in one of three forms.' });
