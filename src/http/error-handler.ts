/**
 * Maps every failure to the error shape {statusCode, code, message, issues?}.
 * Fastify's own errors (bad JSON, wrong content type, body too large) get
 * catalogue codes; anything unexpected is a 500 `internal_error` — which a
 * caller's input must never reach (the fuzz tests hold us to that).
 */
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { LoopgateError } from '../contract/errors.js';

function fromFastify(err: FastifyError): LoopgateError | null {
  if (/prototype property/i.test(err.message)) {
    return new LoopgateError('forbidden_key', 'The body contains a forbidden key (__proto__ or constructor.prototype).');
  }
  switch (err.code) {
    case 'FST_ERR_CTP_BODY_TOO_LARGE':
      return new LoopgateError('body_too_large', 'The body is larger than this route allows.');
    case 'FST_ERR_CTP_INVALID_MEDIA_TYPE':
    case 'FST_ERR_CTP_INVALID_CONTENT_LENGTH':
      return new LoopgateError('unsupported_media_type', 'Send the body as application/json.');
    case 'FST_ERR_CTP_EMPTY_JSON_BODY':
      return new LoopgateError('invalid_json', 'The body is empty; send a JSON object.');
    case 'FST_ERR_CTP_INVALID_JSON_BODY':
      return new LoopgateError('invalid_json', 'The body is not valid JSON.');
  }
  if (err instanceof SyntaxError || (err.statusCode === 400 && /JSON|Unexpected|prototype/i.test(err.message))) {
    return /prototype/i.test(err.message)
      ? new LoopgateError('forbidden_key', 'The body contains a forbidden key (__proto__ or constructor.prototype).')
      : new LoopgateError('invalid_json', `The body is not valid JSON: ${err.message.slice(0, 120)}`);
  }
  if (err.statusCode === 413) return new LoopgateError('body_too_large', 'The body is larger than this route allows.');
  if (err.statusCode === 415) return new LoopgateError('unsupported_media_type', 'Send the body as application/json.');
  return null;
}

export function installErrorHandling(app: FastifyInstance): void {
  app.setErrorHandler((err: FastifyError, request: FastifyRequest, reply: FastifyReply) => {
    const known = err instanceof LoopgateError ? err : fromFastify(err);
    if (known) {
      request.log.info({ code: known.code, statusCode: known.statusCode }, 'request refused');
      return reply.status(known.statusCode).send(known.toJSON());
    }
    request.log.error({ err }, 'internal error');
    return reply.status(500).send(new LoopgateError('internal_error', 'An internal error occurred; please report it with the request.').toJSON());
  });
  app.setNotFoundHandler((request, reply) => {
    reply.status(404).send({ statusCode: 404, code: 'not_found', message: `No route ${request.method} ${request.url.split('?')[0]}.` });
  });
}
