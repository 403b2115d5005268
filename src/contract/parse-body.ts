/** Raw body → typed request: guards, then the zod schema; failures become 400 with issue paths. */
import type { z } from 'zod';
import { LoopgateError } from './errors.js';
import { guardRawBody } from './input-guards.js';

export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  guardRawBody(body);
  const result = schema.safeParse(body);
  if (!result.success) {
    const issues = result.error.issues.slice(0, 50).map((i) => ({
      path: i.path.map((p) => (typeof p === 'symbol' ? String(p) : p)) as (string | number)[],
      message: i.message,
    }));
    const first = issues[0];
    throw new LoopgateError(
      'validation_failed',
      first ? `The request does not match the schema: ${first.message} at ${first.path.join('.') || '(body)'}.` : 'The request does not match the schema.',
      issues,
    );
  }
  return result.data;
}
