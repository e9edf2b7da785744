import { z } from 'zod';
import type { Landmark } from './types';

/**
 * Schema of map.json. Row lengths and the row count depend on `width`/`height`, which JSON
 * Schema cannot express; parse-site-map.ts checks them with the same issue format.
 */
export const ZLandmark = z.strictObject({
  id: z.string().min(1),
  class: z.string().min(1),
  x: z.number().describe('m, map frame'),
  y: z.number().describe('m, map frame'),
});

export const ZMapFile = z.strictObject({
  resolution: z.number().positive().describe('m per cell'),
  origin: z.tuple([z.number(), z.number()]).describe('Map-frame position of the grid south-west corner, m'),
  width: z.int().positive().describe('cells per row'),
  height: z.int().positive().describe('number of rows'),
  rows: z
    .array(z.string().regex(/^[.#?]*$/, 'use only "." (free), "#" (occupied) and "?" (unknown)'))
    .describe('height strings of width characters; rows[0] is the northmost row')
    .optional(),
  landmarks: z.array(ZLandmark).optional(),
});

export type MapFile = z.infer<typeof ZMapFile>;

export type LandmarkSchemaMatchesType = z.infer<typeof ZLandmark> extends Landmark ? true : never;
const landmarkSchemaMatchesType: LandmarkSchemaMatchesType = true;
void landmarkSchemaMatchesType;
