/** Writes the OpenAPI document to docs/openapi.json (run: npx tsx services/api/src/write-openapi.ts). */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { openApiDocument } from './openapi-document.js';

const target = fileURLToPath(new URL('../../../docs/openapi.json', import.meta.url));
writeFileSync(target, JSON.stringify(await openApiDocument(), null, 2) + '\n');
process.stdout.write(`wrote ${target}\n`);
