/**
 * The computations that may run off the event loop, by name. Each takes the
 * raw request body and returns exactly what its route answers (or throws a
 * LoopgateError). The worker and the inline runner both use this table, so
 * the two modes cannot drift apart.
 */
import { analyze } from '../contract/analyze.js';
import { estimate } from '../contract/estimate.js';
import type { LoopTask } from '../gate/check-loop.js';
import { compareTunings } from '../gate/compare-tunings.js';
import { runLoopTask } from '../gate/loop-outcome.js';
import { bodePlotSvg, nyquistPlotSvg, stepPlotSvg } from '../contract/plots.js';
import { reportHtml } from '../contract/report.js';

export const COMPUTE_TASKS = {
  analyze: (body: unknown): unknown => analyze(body),
  estimate: (body: unknown): unknown => estimate(body),
  compare: (body: unknown): unknown => compareTunings(body),
  /** A chunk of an already parsed /v1/checks batch (LoopTask[]): one outcome per loop, refusals as data. */
  checkChunk: (body: unknown): unknown => (body as LoopTask[]).map(runLoopTask),
  bodeFigure: (body: unknown, options?: unknown): unknown => bodePlotSvg(body, (options ?? {}) as { closedLoop?: boolean }),
  nyquistFigure: (body: unknown): unknown => nyquistPlotSvg(body),
  stepPlot: (body: unknown): unknown => stepPlotSvg(body),
  report: (body: unknown): unknown => reportHtml(body),
} as const satisfies Record<string, (body: unknown, options?: unknown) => unknown>;

export type ComputeTaskName = keyof typeof COMPUTE_TASKS;

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
