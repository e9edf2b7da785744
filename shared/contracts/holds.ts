import { z } from 'zod';
import { safeText } from './safe-text';

export const ZPlaceHoldRequest = z.strictObject({
  reason: safeText().trim().min(3, 'Give the reason for the hold (at least 3 characters)').max(2000),
});
export type TPlaceHoldRequest = z.infer<typeof ZPlaceHoldRequest>;

export const ZReleaseHoldRequest = z.strictObject({
  reason: safeText().trim().max(2000).optional(),
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
