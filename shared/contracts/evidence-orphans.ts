import { z } from 'zod';

/** A file under DATA_DIR that no bundle row accounts for. Listed for the admin; never deleted by the server. */
export const ZOrphanFile = z.object({
  /** Path below DATA_DIR, e.g. `incoming/3f…` or `evidence/ab/ab12….bin`. */
  path: z.string(),
  sizeBytes: z.number().int(),
  modifiedAt: z.string(),
});
export type TOrphanFile = z.infer<typeof ZOrphanFile>;

export const ZEvidenceOrphans = z.object({
  checkedAt: z.string(),
  /** Left in `incoming/` by an upload that did not finish (the server stopped, the client went away). */
  incoming: z.array(ZOrphanFile),
  /** Stored originals in `evidence/` that no bundle row names (e.g. the server died between storing and recording). */
  unrecorded: z.array(ZOrphanFile.extend({ sha256: z.string() })),
});
export type TEvidenceOrphans = z.infer<typeof ZEvidenceOrphans>;
