/**
 * The computations that may run off the event loop, by name. Each takes the
 * raw request body and returns exactly what its route answers (or throws a
 * LoopgateError). The worker and the inline runner both use this table, so
 * the two modes cannot drift apart. The JSON answers of single requests
 * come back already serialised (serialized-answer.ts), so the event loop
 * only writes them.
 */
import { analyze } from '../contract/analyze.js';
import { estimate } from '../contract/estimate.js';
import type { LoopTask } from '../gate/check-loop.js';
import { compareTunings } from '../gate/compare-tunings.js';
import { runLoopTask, type LoopOutcome } from '../gate/loop-outcome.js';
import { bodePlotSvg, nyquistPlotSvg, stepPlotSvg } from '../contract/plots.js';
import { reportHtml } from '../contract/report.js';
import { serializeAnswer, type SerializedAnswer } from './serialized-answer.js';

export const COMPUTE_TASKS = {
  analyze: (body: unknown): SerializedAnswer => serializeAnswer(analyze(body)),
  estimate: (body: unknown): SerializedAnswer => serializeAnswer(estimate(body)),
  compare: (body: unknown): SerializedAnswer => serializeAnswer(compareTunings(body)),
  /** A chunk of an already parsed /v1/checks batch (LoopTask[]): one outcome per loop, refusals as data. */
  checkChunk: (body: unknown): LoopOutcome[] => (body as LoopTask[]).map(runLoopTask),
  bodeFigure: (body: unknown, options?: unknown): string => bodePlotSvg(body, (options ?? {}) as { closedLoop?: boolean }),
  nyquistFigure: (body: unknown): string => nyquistPlotSvg(body),
  stepPlot: (body: unknown): string => stepPlotSvg(body),
  report: (body: unknown): string => reportHtml(body),
} as const satisfies Record<string, (body: unknown, options?: unknown) => unknown>;

export type ComputeTaskName = keyof typeof COMPUTE_TASKS;
/** What a task answers: the same whether it ran on a worker or inline. */
export type ComputeResult<T extends ComputeTaskName> = ReturnType<(typeof COMPUTE_TASKS)[T]>;

export interface ComputeRequest {
  id: number;
  task: ComputeTaskName;
  body: unknown;
  options?: unknown;
}

export type ComputeReply =
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: false; error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] } }
  | { id: number; ok: false; fault: string };
