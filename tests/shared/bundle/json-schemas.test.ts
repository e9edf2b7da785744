import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { renderBundleJsonSchemas } from '../../../shared/bundle/json-schemas';
import { fixtureManifest, fixtureMap } from '../../support/bundle-fixtures';

const schemaDir = new URL('../../../shared/bundle/schemas/', import.meta.url);

describe('committed JSON Schemas', () => {
  it.each(Object.entries(renderBundleJsonSchemas()))(
    '%s matches the zod schema (run tools/bundle/write-json-schemas.ts)',
    (name, text) => {
      // Compared as JSON, not text, so the repository formatter may lay the files out its own way.
      expect(JSON.parse(readFileSync(new URL(name, schemaDir), 'utf8'))).toEqual(JSON.parse(text));
    },
  );

  it('lists the required manifest and map fields of the format', () => {
    const manifest = JSON.parse(readFileSync(new URL('manifest.schema.json', schemaDir), 'utf8'));
    const map = JSON.parse(readFileSync(new URL('map.schema.json', schemaDir), 'utf8'));
    // incident-bundle/1: manifest needs format, robot, site, start_time, filter; map needs its geometry.
    expect(manifest.required).toEqual(['format', 'robot', 'site', 'start_time', 'filter']);
    expect(map.required).toEqual(['resolution', 'origin', 'width', 'height']);
    // Every top-level key of a full example appears in the schema.
    expect(Object.keys(manifest.properties)).toEqual(expect.arrayContaining(Object.keys(fixtureManifest())));
    expect(Object.keys(map.properties)).toEqual(expect.arrayContaining(Object.keys(fixtureMap())));
  });
});
