import { z } from 'zod';

const seconds = (description: string) => z.number().nullable().describe(`${description} (seconds; null when not defined, e.g. an unstable loop)`);

export const TimeResponseOptionsSchema = z
  .object({
    duration: z.number().positive().optional().describe('Simulated span, seconds (default: about five settling times of the slowest closed-loop root)'),
    points: z.number().int().min(2).max(20000).optional().describe('Equally spaced samples including t = 0 and t = duration (default 1000, at most 20,000)'),
  })
  .strict()
  .meta({ id: 'TimeResponseOptions', description: 'Ask for closed-loop time responses (rational plants: transfer function, zeros and poles, state space).' });

export const SetpointResponseSchema = z
  .object({
    time: z.array(z.number()).describe('seconds'),
    output: z.array(z.number()).describe('plant output y(t) after a unit setpoint step at t = 0'),
    control: z.array(z.number()).describe('controller output u(t)'),
    finalValue: z.number().nullable().describe('exact closed-loop DC gain T(0); null when the loop is not stable'),
    overshootPercent: z.number().nullable().describe('100·(y_max − y∞)/|y∞|, 0 without overshoot'),
    peakTime: seconds('Time of the largest output; null without overshoot'),
    riseTime: seconds('10–90 % rise time'),
    settlingTime: seconds('Last time |y − y∞| exceeds 2 % of |y∞|'),
    steadyStateError: z.number().nullable().describe('1 − T(0)'),
  })
  .meta({ id: 'SetpointResponse' });

export const LoadDisturbanceResponseSchema = z
  .object({
    time: z.array(z.number()).describe('seconds'),
    output: z.array(z.number()).describe('plant output y(t) after a unit step added at the plant input at t = 0 (setpoint 0)'),
    control: z.array(z.number()).describe('controller output u(t)'),
    finalValue: z.number().nullable().describe('exact final output P(0)/(1 + L(0)); null when the loop is not stable'),
    peakDeviation: z.number().nullable().describe('max |y| over the horizon'),
    peakDeviationTime: seconds('Time of the peak deviation'),
    iae: z.number().nullable().describe('∫|y| dt over the horizon'),
  })
  .meta({ id: 'LoadDisturbanceResponse' });

export const TimeResponseSchema = z
  .object({
    stable: z.boolean().describe('Closed-loop stability as the simulation found it'),
    duration: z.number().describe('seconds'),
    method: z.string().describe('The numerical method, in words'),
    notes: z.array(z.string()),
    setpoint: SetpointResponseSchema,
    loadDisturbance: LoadDisturbanceResponseSchema,
  })
  .meta({ id: 'TimeResponse', description: 'Closed-loop responses to a unit setpoint step and a unit load step at the plant input.' });

export type TimeResponseOptions = z.infer<typeof TimeResponseOptionsSchema>;
export type TimeResponse = z.infer<typeof TimeResponseSchema>;
