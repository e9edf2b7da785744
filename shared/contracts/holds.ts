import { z } from 'zod';

export const ZPlaceHoldRequest = z.object({
  reason: z.string().trim().min(3, 'Give the reason for the hold (at least 3 characters)').max(2000),
});
export type TPlaceHoldRequest = z.infer<typeof ZPlaceHoldRequest>;

export const ZReleaseHoldRequest = z.object({
  reason: z.string().trim().max(2000).optional(),
});
export type TReleaseHoldRequest = z.infer<typeof ZReleaseHoldRequest>;

export const ZCaseHold = z.object({
  id: z.string(),
  caseId: z.string(),
  reason: z.string(),
  placedBy: z.string(),
  placedAt: z.string(),
  releasedBy: z.string().nullable(),
  releasedAt: z.string().nullable(),
  releaseReason: z.string().nullable(),
});
export type TCaseHold = z.infer<typeof ZCaseHold>;
