import { z } from 'zod';
import { ZManifest } from './manifest-schema';
import { ZMapFile } from './map-schema';

const SCHEMA_BASE = 'https://driftcase.example/schemas/incident-bundle/1';

/** JSON Schema texts of manifest.json and map.json, keyed by the file name they are committed under. */
export function renderBundleJsonSchemas(): Record<string, string> {
  const render = (schema: z.ZodType, name: string, title: string) => {
    const json = {
      ...z.toJSONSchema(schema, { target: 'draft-2020-12' }),
      $id: `${SCHEMA_BASE}/${name}`,
      title,
    };
    return `${JSON.stringify(json, null, 2)}\n`;
  };
  return {
    'manifest.schema.json': render(
      ZManifest,
      'manifest.schema.json',
      'Incident bundle manifest.json (incident-bundle/1)',
    ),
    'map.schema.json': render(ZMapFile, 'map.schema.json', 'Incident bundle map.json (incident-bundle/1)'),
  };
}
