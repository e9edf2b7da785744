import { z } from 'zod';
import { safeText, ZSafeJsonValue } from './safe-text';

export const ZLinkFixRequest = z
  .strictObject({
    url: z.url('Use a full URL such as https://tracker.example/CR-118').max(2000).optional(),
    commitId: safeText()
      .trim()
      .regex(/^[0-9a-f]{7,64}$/i, 'Use a commit id of 7 to 64 hex digits')
      .optional(),
    description: safeText().trim().min(3, 'Describe the fix (at least 3 characters)').max(4000),
    /** Free text, or JSON (given as an object) of the settings that changed. */
    changedSettings: z.union([safeText().max(20000), z.record(safeText(), ZSafeJsonValue)]).optional(),
    softwareVersion: safeText().trim().max(200).optional(),
    verificationReplayId: z.uuid('verificationReplayId must be a replay id (UUID)').optional(),
  })
  .refine((body) => body.url || body.commitId, {
    message: 'Give the fix a url or a commitId',
    path: ['url'],
  });
export type TLinkFixRequest = z.infer<typeof ZLinkFixRequest>;

export const ZFix = z.object({
  id: z.string(),
  caseId: z.string(),
  url: z.string().nullable(),
  commitId: z.string().nullable(),
  description: z.string(),
  changedSettings: z.string().nullable(),
  softwareVersion: z.string().nullable(),
  verificationReplayId: z.string().nullable(),
  linkedBy: z.object({ id: z.string(), name: z.string() }),
  linkedAt: z.string(),
  verifiedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
  verifiedAt: z.string().nullable(),
  /** What the verifier checked, in their words; null until verified (and on fixes verified before comments). */
  verificationComment: z.string().nullable(),
  /** True when the verifier confirmed it although the verification replay showed no improvement. */
  isVerifiedWithoutImprovement: z.boolean(),
});
export type TFix = z.infer<typeof ZFix>;

/** Body of `POST /api/cases/:id/fixes/:fixId/verify`. */
export const ZVerifyFixRequest = z.strictObject({
  comment: safeText({ error: 'Write a comment saying what you checked before marking the fix verified' })
    .trim()
    .min(3, 'Write a comment saying what you checked (at least 3 characters)')
    .max(4000, 'Keep the comment under 4,000 characters'),
  /**
   * Needed when the verification replay did not improve on the original (shared/fixes/fix-outcome.ts):
   * the verifier confirms they saw the warning and verify the fix anyway.
   */
  confirmWithoutImprovement: z.boolean().optional(),
});
export type TVerifyFixRequest = z.infer<typeof ZVerifyFixRequest>;
