/**
 * A JSON answer serialised where it was computed. On a compute worker the
 * worker turns the answer into text, and only that one string crosses the
 * thread boundary. The event loop then writes it as it is. Otherwise the
 * answer's whole object graph would be cloned to the main thread and then
 * serialised there as well. A full-detail analysis is about 70 KiB of
 * numbers, and cloning plus serialising it cost the event loop more than
 * the analysis cost the worker.
 */
import type { FastifyReply, FastifyRequest } from 'fastify';

export interface SerializedAnswer {
  /** The answer as JSON text, exactly as fastify would have serialised it. */
  json: string;
  /** Points of the answer's analysis grid, for the log line (request-logging.ts). */
  gridPoints?: number;
}

/** The `grid.points` of an answer that has a grid (analyses); undefined otherwise. */
export function gridPointsOf(answer: unknown): number | undefined {
  if (typeof answer !== 'object' || answer === null) return undefined;
  const grid = (answer as { grid?: { points?: unknown } }).grid;
  return typeof grid?.points === 'number' ? grid.points : undefined;
}

export function serializeAnswer(answer: unknown): SerializedAnswer {
  return { json: JSON.stringify(answer), gridPoints: gridPointsOf(answer) };
}

/** Sends a serialised answer as application/json; fastify passes a string with that type through untouched. */
export function sendSerialized(request: FastifyRequest, reply: FastifyReply, answer: SerializedAnswer): FastifyReply {
  request.answeredGridPoints = answer.gridPoints;
  return reply.type('application/json; charset=utf-8').send(answer.json);
}
