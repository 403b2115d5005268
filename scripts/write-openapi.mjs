// Writes openapi/openapi.json from the built schemas (run `npm run openapi`).
// test/http/openapi.test.ts fails when the committed copy is stale.
import { writeFileSync, mkdirSync } from 'node:fs';
import { buildOpenApiDocument } from '../dist/http/openapi-document.js';

mkdirSync('openapi', { recursive: true });
writeFileSync('openapi/openapi.json', JSON.stringify(buildOpenApiDocument(), null, 2) + '\n');
console.log('wrote openapi/openapi.json');
