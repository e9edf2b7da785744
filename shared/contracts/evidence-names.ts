import { z } from 'zod';

/** GET /api/cases/:id/evidence-names: what a case's citable items are called. */
export const ZEvidenceNamesResponse = z.object({
  replays: z.array(z.object({ id: z.string(), label: z.string(), bundleId: z.string() })),
  bookmarks: z.array(
    z.object({
      id: z.string(),
      note: z.string(),
      t: z.number(),
      replayId: z.string(),
      replayLabel: z.string(),
      bundleId: z.string(),
    }),
  ),
  queries: z.array(z.object({ id: z.string(), title: z.string(), bundleId: z.string() })),
  bundles: z.array(z.object({ id: z.string(), originalName: z.string() })),
  figures: z.array(
    z.object({ id: z.string(), caption: z.string(), fileName: z.string(), sha256: z.string() }),
  ),
});
export type TEvidenceNamesResponse = z.infer<typeof ZEvidenceNamesResponse>;
