import { z } from 'zod';
import type { SensorName, BundleSummary as SharedBundleSummary } from '../bundle/summarize-bundle';
import type { BundleIssue } from '../bundle/types';

/** One problem found in a bundle, located by file, line or JSON path, and field. */
export const ZBundleIssue = z.object({
  file: z.string(),
  line: z.number().int().positive().optional(),
  field: z.string().optional(),
  message: z.string(),
  expected: z.string().optional(),
  found: z.string().optional(),
  severity: z.enum(['error', 'warning']).optional(),
});
export type TBundleIssue = z.infer<typeof ZBundleIssue>;

/** A file inside the uploaded bundle, hashed as stored. */
export const ZBundleFile = z.object({
  name: z.string(),
  /** bytes */
  size: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});
export type TBundleFile = z.infer<typeof ZBundleFile>;

export const SENSOR_NAMES = [
  'odometry',
  'laser',
  'landmark_detector',
] as const satisfies readonly SensorName[];

export const ZBundleSummary = z.object({
  robotId: z.string(),
  site: z.string(),
  startTime: z.string(),
  rows: z.record(z.string(), z.number().int().nonnegative()),
  /** s since startTime */
  timeSpan: z.object({ start: z.number(), end: z.number() }).nullable(),
  durationSeconds: z.number().nonnegative(),
  sensors: z.array(z.enum(SENSOR_NAMES)),
  eventCounts: z.record(z.string(), z.number().int().nonnegative()),
});
export type TBundleSummary = z.infer<typeof ZBundleSummary>;

/**
 * `validating`: the original is stored and recorded but not yet read (an upload in progress, or
 * one the last stop interrupted, finished again at start-up).
 */
export const BUNDLE_STATUSES = ['valid', 'invalid', 'validating'] as const;
export const ZBundleStatus = z.enum(BUNDLE_STATUSES);
export type TBundleStatus = z.infer<typeof ZBundleStatus>;

/**
 * A stored bundle (`GET /api/cases/:id/bundles` items and `GET /api/bundles/:id`): the original's
 * hash and size, who brought it, validation status with its issues, the hash of every file inside,
 * the summary (null when invalid) and the Arrow tables served under `/api/bundles/:id/tables/:name`.
 * Same shape as `ZBundleRecord` in bundle-records.ts, with the reader's stricter field types.
 */
export const ZBundleRecord = z.object({
  id: z.string(),
  caseId: z.string(),
  /** SHA-256 of the uploaded original, lowercase hex: the evidence's identity. */
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  sizeBytes: z.number().int().nonnegative(),
  originalName: z.string(),
  uploadedBy: z.object({ id: z.string(), name: z.string() }),
  uploadedAt: z.string(),
  status: ZBundleStatus,
  issues: z.array(ZBundleIssue),
  files: z.array(ZBundleFile),
  summary: ZBundleSummary.nullable(),
  tables: z.array(z.object({ name: z.string(), rows: z.number().int().nonnegative() })),
});
export type TBundleRecord = z.infer<typeof ZBundleRecord>;

export const ZBundleList = z.object({ items: z.array(ZBundleRecord) });
export type TBundleList = z.infer<typeof ZBundleList>;

/** Body of the 422 answer to an invalid upload: the bundle is stored and listed anyway. */
export const ZBundleRejection = z.object({ bundle: ZBundleRecord, issues: z.array(ZBundleIssue) });
export type TBundleRejection = z.infer<typeof ZBundleRejection>;

// Compile-time guards: the contract must accept what the reader produces.
type Accepts<Contract, Produced> = Produced extends Contract ? true : never;
const summaryMatches: Accepts<TBundleSummary, SharedBundleSummary> = true;
const issueMatches: Accepts<TBundleIssue, BundleIssue> = true;
void summaryMatches;
void issueMatches;

/** Response of an upload: 201 for a new valid bundle, 200 for bytes already on the case. */
export const ZUploadResponse = z.object({ bundle: ZBundleRecord, duplicate: z.boolean() });
export type TUploadResponse = z.infer<typeof ZUploadResponse>;
