// Regenerate the JSON Schemas shipped in schemas/ from the zod definitions in src/config/.
// Run: npm run schemas:update   (compiles first; test/config/jsonSchemas.test.ts checks they are current)
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { publishedSchemas, schemaFileText } from '../dist/config/jsonSchemas.js';

const dir = path.join(path.dirname(fileURLToPath(import.meta.url)), '..', 'schemas');
mkdirSync(dir, { recursive: true });
for (const [name, schema] of Object.entries(publishedSchemas())) {
  writeFileSync(path.join(dir, name), schemaFileText(schema));
  console.log(`wrote schemas/${name}`);
}
