import { z } from 'zod';
import { matrix, num, root, time } from './common.js';
import { coefficientOrderField, discretePlantFields } from './controller-implementation.js';

export const TransferFunctionPlantSchema = z
  .object({
    kind: z.literal('transfer-function'),
    numerator: z.array(num).min(1).describe('Coefficients in descending powers of s (for variable "z": see coefficientOrder).'),
    denominator: z.array(num).min(1).describe('Coefficients in descending powers of s (for variable "z": see coefficientOrder).'),
    delay: time('Pure delay e^{-sT}, exact').optional(),
    ...discretePlantFields,
    ...coefficientOrderField,
  })
  .strict()
  .meta({ id: 'TransferFunctionPlant', description: 'N(s)/D(s)·e^{−sT}.' });

export const ZerosPolesPlantSchema = z
  .object({
    kind: z.literal('zeros-poles'),
    zeros: z.array(root),
    poles: z.array(root),
    gain: num,
    delay: time('Pure delay').optional(),
    ...discretePlantFields,
  })
  .strict()
  .meta({ id: 'ZerosPolesPlant', description: 'k·Π(s − z)/Π(s − p)·e^{−sT}.' });

export const StateSpacePlantSchema = z
  .object({
    kind: z.literal('state-space'),
    a: matrix.describe('n×n'),
    b: matrix.describe('n×1'),
    c: matrix.describe('1×n'),
    d: matrix.describe('1×1 (default [[0]])').optional(),
    delay: time('Input delay').optional(),
  })
  .strict()
  .meta({ id: 'StateSpacePlant', description: 'ẋ = Ax + Bu(t − T), y = Cx + Du(t − T); single input, single output.' });

export const ExpressionPlantSchema = z
  .object({
    kind: z.literal('expression'),
    expression: z.string().min(1).describe('An expression in s: numbers, s, pi, e, + - * / ^, parentheses, exp sqrt sinh cosh tanh sin cos log.'),
    openLoopUnstablePoles: z.number().int().min(0).max(1000).optional().describe('Right-half-plane poles of the plant (default 0, with a warning).'),
  })
  .strict()
  .meta({ id: 'ExpressionPlant', description: 'A transfer function written as an expression in s.' });

export const ParametricPlantSchemas = [TransferFunctionPlantSchema, ZerosPolesPlantSchema, StateSpacePlantSchema, ExpressionPlantSchema] as const;
