/**
 * The JSON text a request body was parsed from, kept on the request by the
 * app's JSON parser (app.ts). A route whose body goes to a compute worker
 * unchanged hands over this text instead of the parsed object: copying a
 * string costs the event loop far less than the structured clone of a
 * nested object (the clone was about a tenth of the event loop's time per
 * summary analysis under load), and the worker parses the same text again
 * into the same value.
 */
import type { FastifyRequest } from 'fastify';

declare module 'fastify' {
  interface FastifyRequest {
    bodyText?: string;
  }
}

/** The body's JSON text, or undefined where the body did not come from the JSON parser. */
export function bodyTextOf(request: FastifyRequest): string | undefined {
  return typeof request.bodyText === 'string' ? request.bodyText : undefined;
}
