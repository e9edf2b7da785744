import { z } from 'zod';

/** One validation problem as the API reports it (see `BundleIssue` in shared/bundle/types.ts). */
export const ZBundleIssueRecord = z.object({
  file: z.string(),
  line: z.number().int().optional(),
  field: z.string().optional(),
  message: z.string(),
  expected: z.string().optional(),
  found: z.string().optional(),
  severity: z.enum(['error', 'warning']).optional(),
});

export const ZBundleFileRecord = z.object({ name: z.string(), size: z.number(), sha256: z.string() });

export const ZBundleSummaryRecord = z.object({
  robotId: z.string(),
  site: z.string(),
  startTime: z.string(),
  rows: z.record(z.string(), z.number()),
  timeSpan: z.object({ start: z.number(), end: z.number() }).nullable(),
  durationSeconds: z.number(),
  sensors: z.array(z.string()),
  eventCounts: z.record(z.string(), z.number()),
});

/** A bundle as listed on a case: the stored original's hash, who brought it, and what validation found. */
export const ZBundleRecord = z.object({
  id: z.string(),
  caseId: z.string(),
  /** SHA-256 of the uploaded original, hex. */
  sha256: z.string(),
  sizeBytes: z.number(),
  originalName: z.string(),
  uploadedBy: z.object({ id: z.string(), name: z.string() }),
  uploadedAt: z.string(),
  status: z.enum(['valid', 'invalid']),
  issues: z.array(ZBundleIssueRecord),
  files: z.array(ZBundleFileRecord),
  summary: ZBundleSummaryRecord.nullable(),
  tables: z.array(z.object({ name: z.string(), rows: z.number() })),
});
export type TBundleRecord = z.infer<typeof ZBundleRecord>;

export const ZBundleList = z.object({ items: z.array(ZBundleRecord) });
export type TBundleList = z.infer<typeof ZBundleList>;

/** Response of an upload: 201 for a new valid bundle, 200 for bytes already on the case. */
export const ZUploadResponse = z.object({ bundle: ZBundleRecord, duplicate: z.boolean() });
export type TUploadResponse = z.infer<typeof ZUploadResponse>;
