import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildApp } from '../../src/http/app.js';
import { buildOpenApiDocument } from '../../src/http/openapi-document.js';
import { ROUTES } from '../../src/http/route-table.js';

describe('OpenAPI document', () => {
  it('is served at /openapi.json as OpenAPI 3.1 with every route', async () => {
    const app = await buildApp();
    const res = await app.inject({ method: 'GET', url: '/openapi.json' });
    await app.close();
    const doc = res.json();
    expect(doc.openapi).toBe('3.1.0');
    for (const r of ROUTES) expect(doc.paths[r.path][r.method.toLowerCase()]).toBeDefined();
    expect(doc.components.schemas.AnalysisRequest.properties.plant).toBeDefined();
  });

  it('committed copy openapi/openapi.json is up to date (run `npm run openapi` after changing a schema)', () => {
    const committed = JSON.parse(readFileSync('openapi/openapi.json', 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(buildOpenApiDocument())));
  });

  it('every $ref points at a component that exists', () => {
    const doc = buildOpenApiDocument();
    const text = JSON.stringify(doc);
    const refs = [...text.matchAll(/"\$ref":"#\/components\/schemas\/([^"]+)"/g)].map((m) => m[1]);
    const schemas = (doc.components as { schemas: Record<string, unknown> }).schemas;
    for (const r of refs) expect(schemas[r], r).toBeDefined();
  });
});
