/**
 * Plain descriptions of plants and controllers, as the contract validates
 * them. The model layer turns them into evaluators.
 */
export type Root = number | { re: number; im: number };

export interface TransferFunctionPlant {
  kind: 'transfer-function';
  numerator: number[];
  denominator: number[];
  delay?: number;
}

export interface ZerosPolesPlant {
  kind: 'zeros-poles';
  zeros: Root[];
  poles: Root[];
  gain: number;
  delay?: number;
}

export interface StateSpacePlant {
  kind: 'state-space';
  a: number[][];
  b: number[][];
  c: number[][];
  d?: number[][];
  delay?: number;
}

export interface ExpressionPlant {
  kind: 'expression';
  expression: string;
  openLoopUnstablePoles?: number;
}

export type ParametricPlant = TransferFunctionPlant | ZerosPolesPlant | StateSpacePlant | ExpressionPlant;

export type { MeasuredPlantDescription } from './plants/measured-data.js';
import type { MeasuredPlantDescription } from './plants/measured-data.js';

/** Every plant kind loopgate analyses. */
export type PlantDescription = ParametricPlant | MeasuredPlantDescription;

export type DerivativeFilter = { n: number } | { timeConstant: number };

export interface ParallelPid {
  kind: 'pid';
  form: 'parallel';
  kp?: number;
  ki?: number;
  kd?: number;
  derivativeFilter?: DerivativeFilter;
}

export interface StandardOrSeriesPid {
  kind: 'pid';
  form: 'standard' | 'series';
  gain: number;
  integralTime?: number;
  derivativeTime?: number;
  derivativeFilter?: DerivativeFilter;
}

export type PidController = ParallelPid | StandardOrSeriesPid;
