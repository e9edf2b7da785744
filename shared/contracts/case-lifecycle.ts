import { z } from 'zod';
import { ZCaseStatus } from './cases';
import { safeText } from './safe-text';

export const ZCaseTransitionRequest = z.strictObject({
  to: ZCaseStatus,
  /** Why, shown in the case history. */
  comment: safeText().trim().max(2000).optional(),
});
export type TCaseTransitionRequest = z.infer<typeof ZCaseTransitionRequest>;

export const ZCaseLifecycle = z.object({
  caseId: z.string(),
  status: ZCaseStatus,
  nextActor: z.object({ roles: z.array(z.string()), action: z.string() }),
  /** The next step the signed-in person's role can take itself; null when the case waits for others. */
  yourMove: z.string().nullable(),
  /** Moves available from here (any role), for buttons on the case page. */
  transitions: z.array(
    z.object({
      to: ZCaseStatus,
      event: z.string(),
      roles: z.array(z.string()),
      cause: z.string(),
      isDirect: z.boolean(),
    }),
  ),
  hold: z.object({ reason: z.string(), placedBy: z.string(), placedAt: z.string() }).nullable(),
});
export type TCaseLifecycle = z.infer<typeof ZCaseLifecycle>;
