/**
 * The OpenAPI 3.1 document, generated from the zod schemas (the one source
 * of request and response types). JSON Schema 2020-12, which OpenAPI 3.1
 * uses, comes straight from zod's own converter; every schema with a
 * `.meta({id})` becomes a component.
 */
import { z } from 'zod';
import { VERSION } from '../version.js';
import { ERROR_CATALOGUE } from '../contract/errors.js';
import { ROUTES } from './route-table.js';

export function buildOpenApiDocument(): Record<string, unknown> {
  // Importing the route table has registered every schema with an id.
  const { schemas } = z.toJSONSchema(z.globalRegistry, {
    uri: (id) => `#/components/schemas/${id}`,
    io: 'input',
    unrepresentable: 'any',
  });
  const components: Record<string, unknown> = {};
  for (const [id, schema] of Object.entries(schemas).sort(([a], [b]) => a.localeCompare(b))) {
    const { $schema: _s, $id: _i, ...rest } = schema as Record<string, unknown>;
    components[id] = rest;
  }
  const errorRef = { $ref: '#/components/schemas/Error' };
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of ROUTES) {
    const responses: Record<string, unknown> = {
      '200': {
        description: r.summary,
        content: { [r.produces ?? 'application/json']: r.response ? { schema: { $ref: `#/components/schemas/${r.response}` } } : { schema: {} } },
      },
    };
    if (r.request) {
      for (const status of ['400', '413', '422']) responses[status] = { description: statusText(status), content: { 'application/json': { schema: errorRef } } };
    }
    paths[r.path] ??= {};
    paths[r.path][r.method.toLowerCase()] = {
      summary: r.summary,
      operationId: r.operationId,
      ...(r.request
        ? { requestBody: { required: true, content: { 'application/json': { schema: { $ref: `#/components/schemas/${r.request}` } } } } }
        : {}),
      responses,
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'loopgate',
      version: VERSION,
      description:
        'Frequency-domain robustness review of PI/PID loops. Frequencies in rad/s, times in seconds, phases in degrees. ' +
        'Error codes: ' + Object.entries(ERROR_CATALOGUE).map(([code, e]) => `${code} (${e.statusCode})`).join(', ') + '.',
    },
    paths,
    components: { schemas: components },
  };
}

function statusText(status: string): string {
  return { '400': 'The body does not match the schema', '413': 'Over a size limit', '422': 'Well formed but cannot be analysed' }[status] ?? status;
}
