import { z } from 'zod';
import { safeText } from './safe-text';

export const SEVERITIES = ['low', 'medium', 'high', 'critical'] as const;
export const ZSeverity = z.enum(SEVERITIES);
export type TSeverity = z.infer<typeof ZSeverity>;

/**
 * Case states. The full lifecycle (review, sign-off) is enforced by the case-work service;
 * a new case starts `open`.
 */
export const CASE_STATUSES = [
  'open',
  'analysing',
  'in_review',
  'changes_requested',
  'signed_off',
  'closed',
] as const;
export const ZCaseStatus = z.enum(CASE_STATUSES);
export type TCaseStatus = z.infer<typeof ZCaseStatus>;

export const CASE_STATUS_LABELS: Record<TCaseStatus, string> = {
  open: 'Open',
  analysing: 'Under analysis',
  in_review: 'In review',
  changes_requested: 'Changes requested',
  signed_off: 'Signed off',
  closed: 'Closed',
};

/** RFC 3339 date-time with an explicit offset (`Z` or `±hh:mm`). */
export const ZRfc3339 = z.iso.datetime({
  offset: true,
  message: 'Use an RFC 3339 time, e.g. 2026-11-14T09:12:00Z',
});

export const ZCreateCaseRequest = z.strictObject({
  title: safeText().trim().min(3, 'Use at least 3 characters').max(200),
  site: safeText().trim().min(1, 'Enter the site').max(120),
  robotId: safeText().trim().min(1, 'Enter the robot id').max(80),
  incidentTime: ZRfc3339,
  severity: ZSeverity,
  summary: safeText().trim().max(4000).optional().default(''),
});
export type TCreateCaseRequest = z.input<typeof ZCreateCaseRequest>;

export const ZUpdateCaseRequest = z
  .strictObject({
    title: safeText().trim().min(3).max(200).optional(),
    site: safeText().trim().min(1).max(120).optional(),
    robotId: safeText().trim().min(1).max(80).optional(),
    incidentTime: ZRfc3339.optional(),
    severity: ZSeverity.optional(),
    summary: safeText().trim().max(4000).optional(),
    status: ZCaseStatus.optional(),
  })
  .refine((body) => Object.keys(body).length > 0, { message: 'Change at least one field' });
export type TUpdateCaseRequest = z.infer<typeof ZUpdateCaseRequest>;

/** Driftcase's own stages of a case, in the order a case passes them. */
export const CASE_STAGES = [
  'evidence_in',
  'replayed',
  'findings_drafted',
  'signed',
  'fix_verified',
  'closed',
] as const;
export const ZCaseStage = z.enum(CASE_STAGES);
export type TCaseStage = z.infer<typeof ZCaseStage>;

/**
 * Where a case stands on its path (see shared/case-path.ts): each stage reached or not and when,
 * the furthest stage reached, who holds the case now, what they do next, and since when.
 */
export const ZCasePath = z.object({
  stages: z.array(
    z.object({
      stage: ZCaseStage,
      /** `done`: reached; `now`: being worked towards; `todo`: not reached; `skipped`: not needed. */
      state: z.enum(['done', 'now', 'todo', 'skipped']),
      /** RFC 3339; when the stage was reached. */
      at: z.string().nullable(),
    }),
  ),
  /** The furthest stage reached; null before any evidence is in. */
  standing: ZCaseStage.nullable(),
  /** Where it stands, in words: `Findings awaiting sign-off`. */
  summary: z.string(),
  /** Roles that hold the case now (empty once closed). */
  holders: z.array(z.string()),
  /** What the holders do next. */
  task: z.string(),
  /** RFC 3339; since when the case stands where it does. */
  since: z.string(),
});
export type TCasePath = z.infer<typeof ZCasePath>;

export const ZCase = z.object({
  id: z.string(),
  reference: z.string(),
  title: z.string(),
  site: z.string(),
  robotId: z.string(),
  incidentTime: z.string(),
  severity: ZSeverity,
  status: ZCaseStatus,
  summary: z.string(),
  createdBy: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
  updatedAt: z.string(),
  path: ZCasePath,
});
export type TCase = z.infer<typeof ZCase>;

export const CASE_SORT_FIELDS = ['incidentTime', 'createdAt', 'title', 'severity', 'status', 'site'] as const;

export const ZCaseListQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  sort: z.enum(CASE_SORT_FIELDS).default('incidentTime'),
  order: z.enum(['asc', 'desc']).default('desc'),
  q: safeText().trim().max(200).optional(),
  status: ZCaseStatus.optional(),
  severity: ZSeverity.optional(),
  site: safeText().trim().max(120).optional(),
});
export type TCaseListQuery = z.input<typeof ZCaseListQuery>;

export const ZCaseList = z.object({
  items: z.array(ZCase),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type TCaseList = z.infer<typeof ZCaseList>;
