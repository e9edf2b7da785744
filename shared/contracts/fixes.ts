import { z } from 'zod';

export const ZLinkFixRequest = z
  .object({
    url: z.url('Use a full URL such as https://tracker.example/CR-118').max(2000).optional(),
    commitId: z
      .string()
      .trim()
      .regex(/^[0-9a-f]{7,64}$/i, 'Use a commit id of 7 to 64 hex digits')
      .optional(),
    description: z.string().trim().min(3, 'Describe the fix (at least 3 characters)').max(4000),
    /** Free text, or JSON (given as an object) of the settings that changed. */
    changedSettings: z.union([z.string().max(20000), z.record(z.string(), z.unknown())]).optional(),
    softwareVersion: z.string().trim().max(200).optional(),
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
});
export type TFix = z.infer<typeof ZFix>;
