import { z } from 'zod';
import { CAUSE_KINDS } from '../engine/causes/cause-types';
import { safeText } from './safe-text';

export const INCIDENT_CLASSES = [
  'near_miss',
  'contact_no_injury',
  'contact_injury',
  'property_damage',
] as const;
export const INCIDENT_CLASS_LABELS: Record<(typeof INCIDENT_CLASSES)[number], string> = {
  near_miss: 'Near miss',
  contact_no_injury: 'Contact without injury',
  contact_injury: 'Contact with injury',
  property_damage: 'Property damage',
};

/** Root-cause categories for mobile-robot localization incidents. */
export const CAUSE_CATEGORIES = [
  'odometry_fault',
  'sensor_degradation',
  'map_out_of_date',
  'external_displacement',
  'filter_configuration',
  'timing_or_data_loss',
  'environment',
  'human_factors',
  'other',
] as const;
export const CAUSE_CATEGORY_LABELS: Record<(typeof CAUSE_CATEGORIES)[number], string> = {
  odometry_fault: 'Odometry fault',
  sensor_degradation: 'Sensor degradation',
  map_out_of_date: 'Map out of date',
  external_displacement: 'Robot moved by an outside force',
  filter_configuration: 'Filter configuration',
  timing_or_data_loss: 'Timing or data loss',
  environment: 'Environment',
  human_factors: 'Human factors',
  other: 'Other',
};

const ZSha256 = z.string().regex(/^[0-9a-f]{64}$/, 'Use a SHA-256 as 64 lowercase hex digits');

export const ZCause = z.strictObject({
  category: z.enum(CAUSE_CATEGORIES),
  text: safeText().trim().min(1, 'Describe the cause').max(4000),
});

/** What a finding cites; the cited hash is stored so the citation stays verifiable. */
export const ZEvidenceItem = z.discriminatedUnion('type', [
  z.strictObject({
    type: z.literal('replay'),
    replayId: z.uuid(),
    digest: safeText().min(1).max(200),
    note: safeText().max(2000).optional(),
  }),
  z.strictObject({
    type: z.literal('bookmark'),
    bookmarkId: z.uuid(),
    note: safeText().max(2000).optional(),
  }),
  z.strictObject({
    type: z.literal('saved_query'),
    queryId: z.uuid(),
    resultSha256: ZSha256,
    note: safeText().max(2000).optional(),
  }),
  z.strictObject({
    // A probable cause of a replay (docs/causes.md), cited by the replay's digest and the cause's kind.
    type: z.literal('cause'),
    replayId: z.uuid(),
    digest: safeText().min(1).max(200),
    kind: z.enum(CAUSE_KINDS),
    note: safeText().max(2000).optional(),
  }),
  z.strictObject({
    type: z.literal('bundle_file'),
    bundleId: z.uuid(),
    file: safeText().min(1).max(500),
    sha256: ZSha256,
    note: safeText().max(2000).optional(),
  }),
  z.strictObject({
    // A picture saved to the case (map or timeline at a moment), cited by its id and SHA-256.
    type: z.literal('figure'),
    figureId: z.uuid(),
    sha256: ZSha256,
    note: safeText().max(2000).optional(),
  }),
]);
export type TEvidenceItem = z.infer<typeof ZEvidenceItem>;

export const ZCorrectiveAction = z.strictObject({
  description: safeText().trim().min(1, 'Describe the action').max(2000),
  owner: safeText().trim().min(1, 'Name the owner').max(200),
  dueDate: z.iso.date('Use a date such as 2026-12-01 (RFC 3339 full-date)'),
});

/** Complete findings, as a submitted version must be. The web form uses the same schema. */
export const ZFindingsContent = z.strictObject({
  summary: safeText().trim().min(1, 'Write a summary').max(20000),
  incidentClass: z.enum(INCIDENT_CLASSES),
  rootCause: ZCause,
  contributingFactors: z.array(ZCause).max(50).default([]),
  evidence: z.array(ZEvidenceItem).max(200).default([]),
  correctiveActions: z.array(ZCorrectiveAction).max(100).default([]),
});
export type TFindingsContent = z.infer<typeof ZFindingsContent>;

/** A draft may be incomplete; submitting checks it against `ZFindingsContent`. */
export const ZFindingsDraft = ZFindingsContent.partial();
export type TFindingsDraft = z.infer<typeof ZFindingsDraft>;

const ZPerson = z.object({ id: z.string(), name: z.string(), email: z.string() });

export const ZSignatureStatus = z.object({
  valid: z.boolean(),
  kid: z.string().nullable(),
  signedBy: z.string().nullable(),
  signedAt: z.string().nullable(),
  error: z.string().optional(),
});
export type TSignatureStatus = z.infer<typeof ZSignatureStatus>;

export const VERSION_STATES = ['submitted', 'returned', 'signed', 'superseded'] as const;

export const ZFindingsResponse = z.object({
  caseId: z.string(),
  caseStatus: z.string(),
  draft: z.object({ content: ZFindingsDraft, updatedBy: ZPerson, updatedAt: z.string() }).nullable(),
  latestVersion: z.number().int().nullable(),
  canEdit: z.boolean(),
  /** Why editing is refused now, when it is. */
  editBlockedReason: z.string().nullable(),
  safetyCaution: z.string(),
});
export type TFindingsResponse = z.infer<typeof ZFindingsResponse>;

export const ZReview = z.object({
  kind: z.enum(['signoff', 'return']),
  reviewer: ZPerson,
  at: z.string(),
  comment: z.string().nullable(),
  jws: z.string().nullable(),
});

export const ZFindingsVersionSummary = z.object({
  version: z.number().int(),
  sha256: z.string(),
  author: ZPerson,
  submittedAt: z.string(),
  state: z.enum(VERSION_STATES),
});
export type TFindingsVersionSummary = z.infer<typeof ZFindingsVersionSummary>;

export const ZFindingsVersion = ZFindingsVersionSummary.extend({
  caseId: z.string(),
  content: ZFindingsContent,
  /** The exact RFC 8785 text that was hashed and signed. */
  canonical: z.string(),
  reviews: z.array(ZReview),
  /** Re-checked on every read; null when the version is not signed. */
  signature: ZSignatureStatus.nullable(),
  safetyCaution: z.string(),
});
export type TFindingsVersion = z.infer<typeof ZFindingsVersion>;

export const ZSubmitFindingsResponse = z.object({
  version: z.number().int(),
  sha256: z.string(),
  safetyCaution: z.string(),
});

export const ZSignoffRequest = z.strictObject({
  acknowledgeCaution: z.literal(true, 'Tick that you have read the safety caution before signing'),
});
export const ZReturnRequest = z.strictObject({
  comment: safeText().trim().min(1, 'Say what needs to change').max(10000),
});

export const ZSignoffResponse = z.object({
  version: z.number().int(),
  jws: z.string(),
  signature: ZSignatureStatus,
  safetyCaution: z.string(),
});

export const ZFindingsDiff = z.object({
  from: z.number().int(),
  to: z.number().int(),
  changes: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })),
});
export type TFindingsDiff = z.infer<typeof ZFindingsDiff>;
