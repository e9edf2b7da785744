import { z } from 'zod';

export const ZAuditListQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type TAuditListQuery = z.input<typeof ZAuditListQuery>;

export const ZAuditEntry = z.object({
  id: z.number().int(),
  chain: z.string(),
  chainSeq: z.number().int(),
  actorId: z.string().nullable(),
  actorEmail: z.string().nullable(),
  actorRole: z.string().nullable(),
  action: z.string(),
  targetType: z.string(),
  targetId: z.string().nullable(),
  caseId: z.string().nullable(),
  at: z.string(),
  payloadSha256: z.string(),
  details: z.record(z.string(), z.unknown()),
  prevHash: z.string(),
  entryHash: z.string(),
});
export type TAuditEntry = z.infer<typeof ZAuditEntry>;

/** Entries in chain order (oldest first). */
export const ZAuditList = z.object({
  items: z.array(ZAuditEntry),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type TAuditList = z.infer<typeof ZAuditList>;

export const ZAuditVerifyResponse = z.object({
  ok: z.boolean(),
  entries: z.number().int(),
  firstBroken: z
    .object({ chainSeq: z.number().int(), id: z.number().int().optional(), reason: z.string() })
    .optional(),
});
export type TAuditVerifyResponse = z.infer<typeof ZAuditVerifyResponse>;
