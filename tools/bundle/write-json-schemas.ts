/**
 * Writes the JSON Schemas of manifest.json and map.json from their zod schemas, so the validator
 * and the documentation share one source: `npx tsx tools/bundle/write-json-schemas.ts`.
 * tests/shared/bundle/json-schemas.test.ts fails when the committed files are stale.
 */
import { writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { renderBundleJsonSchemas } from '../../shared/bundle/json-schemas';

const schemaDir = new URL('../../shared/bundle/schemas/', import.meta.url);

for (const [fileName, text] of Object.entries(renderBundleJsonSchemas())) {
  const target = fileURLToPath(new URL(fileName, schemaDir));
  await writeFile(target, text);
  process.stdout.write(`wrote ${target}\n`);
}
