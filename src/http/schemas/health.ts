import { z } from 'zod';

export const HealthSchema = z.object({ status: z.literal('ok'), version: z.string() }).meta({ id: 'Health' });
